// The one place that gathers the tables for Drizzle's relational API and drizzle-kit.
export * from './users';
export * from './stations';
export * from './devices';
export * from './customers';
export * from './orders';
export * from './moulds';
export * from './trays';
export * from './scans';
export * from './reference-data';
export * from './shipping';
export * from './reports';
export * from './loads';
export * from './payments';
export * from './quotes';
export * from './projections';
