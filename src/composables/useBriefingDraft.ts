import { ref, type Ref } from 'vue';
import type { Draft, DraftSection, SaveDraftRequest, SectionKind } from '@shared/schemas/briefings';

export interface BriefingDraftForm {
  form: Ref<SaveDraftRequest & { sections: DraftSection[] }>;
  /** Stable keys for the section cards while they move. */
  keys: Ref<number[]>;
  /** Field errors by path, e.g. "sections.2.heading". */
  errors: Ref<Record<string, string>>;
  sectionErrors(index: number): Record<string, string>;
  load(draft: Draft): void;
  add(kind: SectionKind): void;
  move(index: number, by: -1 | 1): void;
  remove(index: number): void;
}

const NEW_SECTION: Record<SectionKind, () => DraftSection> = {
  chart: () => ({ kind: 'chart', heading: 'Added runoff by month', caption: '', contentKey: 'monthly-added-melt' }),
  table: () => ({ kind: 'table', heading: 'Totals per variant', caption: '', contentKey: 'totals' }),
  text: () => ({ kind: 'text', heading: 'What this means', bodyMarkdown: '' }),
  // The study is chosen in the section (0: none chosen yet, which the form refuses).
  regional: () => ({ kind: 'regional', heading: 'Added runoff across the region', caption: '', studyId: 0, contentKey: 'regional-by-catchment' }),
};

/** The editable copy of a briefing draft: ordered sections added, moved and removed in place. */
export function useBriefingDraft(): BriefingDraftForm {
  const form = ref<SaveDraftRequest & { sections: DraftSection[] }>({ title: '', summary: '', selection: { runIds: [] }, sections: [] });
  const keys = ref<number[]>([]);
  const errors = ref<Record<string, string>>({});
  let nextKey = 0;

  /** A deep copy: the draft may be a reactive proxy, which structuredClone refuses. */
  function load(draft: Draft): void {
    form.value = { title: draft.title, summary: draft.summary, selection: { runIds: [...draft.selection.runIds] }, sections: JSON.parse(JSON.stringify(draft.sections)) as DraftSection[] };
    keys.value = draft.sections.map(() => nextKey++);
    errors.value = {};
  }

  function sectionErrors(index: number): Record<string, string> {
    const prefix = `sections.${index}.`;
    return Object.fromEntries(Object.entries(errors.value).filter(([k]) => k.startsWith(prefix)).map(([k, v]) => [k.slice(prefix.length), v]));
  }

  function add(kind: SectionKind): void {
    form.value.sections.push(NEW_SECTION[kind]());
    keys.value.push(nextKey++);
  }

  function move(index: number, by: -1 | 1): void {
    const to = index + by;
    if (to < 0 || to >= form.value.sections.length) return;
    for (const list of [form.value.sections, keys.value] as unknown[][]) [list[index], list[to]] = [list[to], list[index]];
  }

  function remove(index: number): void {
    form.value.sections.splice(index, 1);
    keys.value.splice(index, 1);
  }

  return { form, keys, errors, sectionErrors, load, add, move, remove };
}
