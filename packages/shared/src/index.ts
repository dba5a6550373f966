// Schemas of the API shared by the server (validation) and the web app (forms, responses).
export * from './api/errors.ts';
export * from './api/health.ts';
export * from './api/auth.ts';
