/** What a solve returns: the types and `resultJson` live in shared/result.ts (the app and the server read them). */
export * from '../../shared/result';
