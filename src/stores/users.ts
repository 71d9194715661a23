import { ref } from 'vue';
import { defineStore } from 'pinia';
import { usersApi, type Role, type User, type UserChange } from '@/services/users';

export const useUsersStore = defineStore('users', () => {
  const items = ref<User[]>([]);
  const total = ref(0);
  const loading = ref(false);

  async function load(): Promise<void> {
    loading.value = true;
    try {
      const list = await usersApi.list();
      items.value = list.items;
      total.value = list.total;
    } finally {
      loading.value = false;
    }
  }

  async function change(id: number, patch: UserChange): Promise<User> {
    const updated = await usersApi.update(id, patch);
    items.value = items.value.map((item) => (item.id === updated.id ? updated : item));
    return updated;
  }

  const setRole = (id: number, role: Role) => change(id, { role });
  const setActive = (id: number, active: boolean) => change(id, { active });

  return { items, total, loading, load, setRole, setActive };
});
