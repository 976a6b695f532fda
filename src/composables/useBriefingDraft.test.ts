import { describe, expect, it } from 'vitest';
import type { Draft } from '@shared/schemas/briefings';
import { useBriefingDraft } from './useBriefingDraft';

const DRAFT: Draft = {
  id: 1, catchmentId: 2, catchmentName: 'Hollin valley', title: 'Soot', summary: '', selection: { runIds: [5] },
  sections: [
    { kind: 'text', heading: 'A', bodyMarkdown: 'a' },
    { kind: 'chart', heading: 'B', caption: '', contentKey: 'monthly-added-melt' },
  ],
  latestVersion: 0, versions: [], sharedWith: [],
};

describe('useBriefingDraft', () => {
  it('edits a copy: changing the form leaves the loaded draft alone', () => {
    const d = useBriefingDraft();
    d.load(DRAFT);
    d.form.value.sections[0].heading = 'changed';
    d.form.value.selection.runIds.push(6);
    expect(DRAFT.sections[0].heading).toBe('A');
    expect(DRAFT.selection.runIds).toEqual([5]);
  });

  it('adds, moves and removes sections, keeping each card key with its section', () => {
    const d = useBriefingDraft();
    d.load(DRAFT);
    d.add('table');
    expect(d.form.value.sections.map((s) => s.heading)).toEqual(['A', 'B', 'Totals per variant']);
    const [ka, kb, kc] = d.keys.value;
    d.move(2, -1);
    expect(d.form.value.sections.map((s) => s.heading)).toEqual(['A', 'Totals per variant', 'B']);
    expect(d.keys.value).toEqual([ka, kc, kb]);
    d.move(0, -1); // already first: nothing happens
    expect(d.keys.value).toEqual([ka, kc, kb]);
    d.remove(0);
    expect(d.form.value.sections.map((s) => s.heading)).toEqual(['Totals per variant', 'B']);
    expect(d.keys.value).toEqual([kc, kb]);
  });

  it('hands each section card only its own field errors', () => {
    const d = useBriefingDraft();
    d.load(DRAFT);
    d.errors.value = { 'sections.1.heading': 'Give the section a heading.', 'sections.10.heading': 'other', title: 'x' };
    expect(d.sectionErrors(1)).toEqual({ heading: 'Give the section a heading.' });
    expect(d.sectionErrors(0)).toEqual({});
  });
});
