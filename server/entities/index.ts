import { UserSchema } from './user';

/** Every entity of the server, listed explicitly (no folder scanning). */
export const entities = [UserSchema];
