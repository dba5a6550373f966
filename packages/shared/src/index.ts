// Shared by the server (validation, authority) and the web app (forms, responses, buttons).
export * from './roles.ts';
export * from './abilities.ts';
export * from './api/common.ts';
export * from './api/errors.ts';
export * from './api/health.ts';
export * from './api/password-policy.ts';
export * from './api/auth.ts';
export * from './api/members.ts';
export * from './api/orgs.ts';
export * from './api/canonical-json.ts';
export * from './api/projects.ts';
export * from './api/worksheets.ts';
export * from './api/model-library.ts';
export * from './workflow.ts';
export * from './api/review.ts';
