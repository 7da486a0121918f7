// Shared request/response schemas and types: one schema per payload, used by forms and by the server.
export * from './errors';
export * from './roles';
export * from './common';
export * from './auth';
export * from './admin';
export * from './domain';
export * from './teardowns';
export * from './settings';
export * from './inputs';
export * from './devices';
export * from './findings';
export * from './figures';
export * from './cautions';
