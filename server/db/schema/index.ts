// Every table of the registry, one file per table group.
export * from './clinics';
export * from './users';
export * from './reference';
export * from './episodes';
export * from './registry';
export * from './follow-ups';
export * from './data-version';
export * from './research';
