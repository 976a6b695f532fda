import { meResponseSchema, type PasswordChange, type SignInRequest, type SignUpRequest } from '@shared/schemas/auth';
import { messageReplySchema } from '@shared/schemas/members';
import { api } from './http';

export const authApi = {
  me: () => api.get('/api/me', meResponseSchema, { quiet: true }),
  signIn: (body: SignInRequest) => api.post('/api/auth/sign-in', body, { schema: meResponseSchema, quiet: true }),
  signUp: (body: SignUpRequest) => api.post('/api/auth/sign-up', body, { schema: messageReplySchema, quiet: true }),
  confirmSignUp: (token: string) => api.post('/api/auth/sign-up/confirm', { token }, { schema: meResponseSchema, quiet: true }),
  signOut: () => api.post('/api/auth/sign-out'),
  changePassword: (body: PasswordChange) => api.post('/api/auth/password', body, { schema: meResponseSchema, quiet: true }),
};
