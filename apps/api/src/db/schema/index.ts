export * from './city.ts';
export * from './people.ts';
export * from './records.ts';
