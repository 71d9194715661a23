import { computed, ref } from 'vue';
import { passwordSchema } from '@shared/schemas/auth';
import { capitalise } from '@/utils/formatQuantity';

/**
 * A new password typed twice, checked with the same schema the server uses, so the person learns the rule
 * (length, no repetition, no common password) before a round trip.
 */
export function useNewPassword() {
  const password = ref('');
  const repeat = ref('');
  const errors = computed(() => {
    const found: Record<string, string> = {};
    const parsed = passwordSchema.safeParse(password.value);
    if (!parsed.success) found.password = `${capitalise(parsed.error.issues[0].message)}.`;
    if (repeat.value !== password.value) found.repeat = 'The two entries differ. Type the same password twice.';
    return found;
  });
  return { password, repeat, errors };
}
