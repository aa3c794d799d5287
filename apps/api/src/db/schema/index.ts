export * from './city.ts';
export * from './people.ts';
export * from './records.ts';
export * from './weather.ts';
export * from './standards.ts';
export * from './work.ts';
export * from './requests.ts';
export * from './budget.ts';
