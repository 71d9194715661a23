import type { Ref } from 'vue';
import { notify } from '@/composables/useNotices';

/** A study form that can take a seed back, so the same random numbers can be drawn again. */
interface SeededForm {
  useSeed(seed: number): void;
}

/** "Rerun with this seed": fills the seed into the form, brings the form into view and says what to do next. */
export function useSeedRerun(form: Ref<SeededForm | null>, formTitleId: string) {
  return (seed: number) => {
    form.value?.useSeed(seed);
    document.getElementById(formTitleId)?.scrollIntoView({ behavior: 'smooth' });
    notify.info('Seed filled in', `Seed ${seed} is in the form; start the study to repeat the same random numbers.`);
  };
}
