import { userListResponseSchema, userResponseSchema, type User, type UserUpdateRequest } from '../../shared/schemas/auth';
import { request } from './client';

export async function listUsers(): Promise<User[]> {
  return (await request('GET', '/users', { schema: userListResponseSchema })).users;
}

export async function updateUser(id: string, change: UserUpdateRequest): Promise<User> {
  return (await request('PATCH', `/users/${encodeURIComponent(id)}`, { body: change, schema: userResponseSchema })).user;
}
