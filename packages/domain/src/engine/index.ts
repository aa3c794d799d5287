/** The turf engine: pure, unit-aware computations (SI inside). */
export * from './units.ts';
export * from './dates.ts';
export * from './standards.ts';
export * from './growth.ts';
export * from './mowing.ts';
export * from './labour.ts';
export * from './routing.ts';
export * from './fao56.ts';
export * from './water.ts';
export * from './feed.ts';
export * from './lines.ts';
export * from './grading.ts';
export * from './outlook.ts';
export * from './cautions.ts';
export * from './weekgen.ts';
export * from './week-warnings.ts';
export * from './closures.ts';
