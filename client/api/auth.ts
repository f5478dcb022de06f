import type { MeDto } from '@shared/types/member';
import type { SignInInput, SignUpInput, UpdateMeInput } from '@shared/schemas/auth';
import { http, resetCsrfToken } from './http';

type Message = { ok: true; message: string };

/** The signed-in member, or null when signed out. */
export async function fetchMe(): Promise<MeDto | null> {
  return (await http.get<{ member: MeDto | null }>('/api/auth/session')).member;
}

/** Creates an account; the answer never says whether the e-mail was already known. */
export const signUp = (input: SignUpInput) => http.post<Message>('/api/auth/signup', input);

/** Signs in; the session changes, so the CSRF token is fetched again afterwards. */
export async function signIn(input: SignInInput): Promise<MeDto> {
  const result = await http.post<{ member: MeDto }>('/api/auth/signin', input);
  resetCsrfToken();
  return result.member;
}

/** Ends the session on the server (and the member's other sessions). */
export async function signOut(): Promise<void> {
  await http.post('/api/auth/signout');
  resetCsrfToken();
}

export const verifyEmail = (token: string) =>
  http.post<Message & { email: string }>('/api/auth/verify', { token });
export const resendVerification = () => http.post<Message>('/api/auth/verify/resend');
export const forgotPassword = (email: string) =>
  http.post<Message>('/api/auth/password/forgot', { email });
export const resetPassword = (token: string, password: string) =>
  http.post<Message>('/api/auth/password/reset', { token, password });
export const changePassword = (currentPassword: string, newPassword: string) =>
  http.patch<Message>('/api/auth/password', { currentPassword, newPassword });
export const updateMe = (input: UpdateMeInput) =>
  http.patch<{ member: MeDto; message?: string }>('/api/auth/me', input);

/** Deletes the account for good. */
export async function deleteMe(password: string): Promise<void> {
  await http.delete('/api/auth/me', { password });
  resetCsrfToken();
}
