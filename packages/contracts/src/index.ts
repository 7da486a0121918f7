// Shared request/response schemas and types: one schema per payload, used by forms and by the server.
export * from './errors';
export * from './roles';
export * from './common';
export * from './auth';
export * from './admin';
export * from './domain';
export * from './teardowns';
export * from './settings';
export * from './photos';
export * from './tools';
export * from './parts';
export * from './power';
export * from './measurements';
export * from './cost';
export * from './runs';
