import { computed, h, ref } from 'vue';
import { NSelect, NSwitch, useMessage, type DataTableColumns } from 'naive-ui';
import type { Role, User } from '../../shared/schemas/auth';
import { useSessionStore } from '@/stores/session';
import { useUsersStore } from '@/stores/users';

const roleOptions = [
  { label: 'Admin', value: 'admin' },
  { label: 'Member', value: 'member' },
];

/** Columns, filtering and actions of the admin's account table. */
export function useAccountTable() {
  const store = useUsersStore();
  const session = useSessionStore();
  const message = useMessage();
  const filter = ref('');

  const rows = computed(() => {
    const q = filter.value.trim().toLowerCase();
    if (!q) return store.users;
    return store.users.filter((u) => u.name.toLowerCase().includes(q) || u.email.includes(q) || u.role.includes(q));
  });

  async function change(user: User, patch: { role?: Role; disabled?: boolean }, done: string) {
    try {
      await store.update(user.id, patch);
      message.success(done);
    } catch (error) {
      message.error((error as Error).message);
    }
  }

  const columns: DataTableColumns<User> = [
    { title: 'Name', key: 'name', sorter: (a, b) => a.name.localeCompare(b.name) },
    { title: 'E-mail', key: 'email', sorter: (a, b) => a.email.localeCompare(b.email) },
    {
      title: 'Role', key: 'role', width: 150,
      sorter: (a, b) => a.role.localeCompare(b.role),
      filterOptions: roleOptions, filter: (value, row) => row.role === value,
      render: (row) => h(NSelect, {
        size: 'small', value: row.role, options: roleOptions, disabled: row.id === session.user?.id,
        'onUpdate:value': (role: Role) => change(row, { role }, `${row.name} is now ${role}`),
      }),
    },
    {
      title: 'Active', key: 'disabled', width: 90,
      render: (row) => h(NSwitch, {
        size: 'small', value: !row.disabled, disabled: row.id === session.user?.id,
        'onUpdate:value': (active: boolean) => change(row, { disabled: !active }, active ? `${row.name} enabled` : `${row.name} disabled`),
      }),
    },
    {
      title: 'Created', key: 'createdAt', width: 130,
      sorter: (a, b) => a.createdAt.localeCompare(b.createdAt),
      render: (row) => row.createdAt.slice(0, 10),
    },
  ];

  return { store, filter, rows, columns };
}
