import { defineStore } from 'pinia';
import { ref } from 'vue';
import type { User, UserUpdateRequest } from '../../shared/schemas/auth';
import * as usersApi from '@/api/users';

/** The account list an admin manages. */
export const useUsersStore = defineStore('users', () => {
  const users = ref<User[]>([]);
  const loading = ref(false);

  async function refresh(): Promise<void> {
    loading.value = true;
    try {
      users.value = await usersApi.listUsers();
    } finally {
      loading.value = false;
    }
  }

  async function update(id: string, change: UserUpdateRequest): Promise<void> {
    const updated = await usersApi.updateUser(id, change);
    users.value = users.value.map((u) => (u.id === id ? updated : u));
  }

  return { users, loading, refresh, update };
});
