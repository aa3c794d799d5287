export * from './vocabulary.ts';
export * from './errors.ts';
export * from './abilities.ts';
export * from './schemas/index.ts';
export * from './geometry.ts';
export * from './clock.ts';
export * from './engine/index.ts';
export * from './contracts/index.ts';
