import { userResponseSchema, type LoginRequest, type RegisterRequest, type User } from '../../shared/schemas/auth';
import { ApiError, request } from './client';

export async function fetchCurrentUser(): Promise<User | null> {
  try {
    return (await request('GET', '/auth/me', { schema: userResponseSchema })).user;
  } catch (error) {
    if (error instanceof ApiError && error.status === 401) return null;
    throw error;
  }
}

export async function login(body: LoginRequest): Promise<User> {
  return (await request('POST', '/auth/login', { body, schema: userResponseSchema })).user;
}

export async function register(body: RegisterRequest): Promise<User> {
  return (await request('POST', '/auth/register', { body, schema: userResponseSchema })).user;
}

export async function logout(): Promise<void> {
  await request('POST', '/auth/logout');
}
