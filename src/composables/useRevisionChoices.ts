import { ref } from 'vue';
import { designsApi, REVISION_STATE_LABELS, type RevisionState } from '@/services/designs';

export interface RevisionChoice {
  value: number;
  label: string;
  designName: string;
  letter: string;
  state: RevisionState;
}

/** Every design revision as a choice for a Select ("PM-2 pack monitor, revision A (Approved)"), newest design first. */
export function useRevisionChoices() {
  const choices = ref<RevisionChoice[]>([]);
  const loaded = ref(false);

  async function load(): Promise<RevisionChoice[]> {
    const list = await designsApi.list({ sort: 'name', order: 'asc', page: 1, pageSize: 200 });
    const details = await Promise.all(list.items.map((d) => designsApi.get(d.id)));
    choices.value = details.flatMap((design) => design.revisions.map((r) => ({
      value: r.id,
      label: `${design.name}, revision ${r.letter} (${REVISION_STATE_LABELS[r.state] ?? r.state})`,
      designName: design.name,
      letter: r.letter,
      state: r.state,
    })));
    loaded.value = true;
    return choices.value;
  }

  return { choices, loaded, load };
}
