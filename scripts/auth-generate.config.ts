// Read only by better-auth's schema generator (see DEVELOPERS.md, "Auth tables").
import { betterAuth } from 'better-auth';
import { authOptions } from '../src/lib/auth';

export const auth = betterAuth(authOptions());
