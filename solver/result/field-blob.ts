/** The field blob format lives in shared/field-blob.ts (the app, the server and the worker all use it). */
export * from '../../shared/field-blob';
