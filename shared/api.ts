/**
 * Types and names shared by the app, the server and other API clients (see ../shared/api.md), one file an area
 * in shared/api/. Import them from here (`shared/api`), never from a part; only the parts import each other.
 */
export * from './api/common';
export * from './api/auth';
export * from './api/workspaces';
export * from './api/designs';
export * from './api/library';
export * from './api/activity';
export * from './api/mailbox';
export * from './api/sweeps';
export * from './api/files';
