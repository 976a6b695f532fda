import type { DraftSection } from '../../../shared/schemas/briefings';
import { draftSectionSchema } from '../../../shared/schemas/briefings';
import type { TenantScope } from '../tenant-scope';

interface SectionRow { kind: DraftSection['kind']; heading: string; content_key: string | null; caption: string; body_markdown: string | null; study_id: number | null }

/** A draft's sections in their order. */
export async function draftSectionsOf(scope: TenantScope, briefingId: number): Promise<DraftSection[]> {
  const rows = (await scope.from('briefing_sections').where({ briefing_id: briefingId }).orderBy('position')) as SectionRow[];
  return rows.map((r) => draftSectionSchema.parse(
    r.kind === 'text'
      ? { kind: 'text', heading: r.heading, bodyMarkdown: r.body_markdown ?? '' }
      : { kind: r.kind, heading: r.heading, caption: r.caption, contentKey: r.content_key, ...(r.kind === 'regional' ? { studyId: r.study_id } : {}) },
  ));
}

/** Rows for the sections table, positioned in the order given. */
export function sectionRows(briefingId: number, sections: DraftSection[]) {
  return sections.map((s, position) => ({
    briefing_id: briefingId, position, kind: s.kind, heading: s.heading,
    content_key: s.kind === 'text' ? null : s.contentKey,
    caption: s.kind === 'text' ? '' : s.caption,
    body_markdown: s.kind === 'text' ? s.bodyMarkdown : null,
    study_id: s.kind === 'regional' ? s.studyId : null,
  }));
}
