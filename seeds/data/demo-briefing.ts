import type { DraftSection } from '../../shared/schemas/briefings';

/** The demo's variant scenario (seeds/03_demo_scenarios.ts) whose run the briefing reports. */
export const DEMO_VARIANT_SCENARIO = 'Black carbon, moderate';

/** The published demo briefing; invented wording about the invented catchment. Cautions are added on publishing. */
export const DEMO_BRIEFING: { title: string; summary: string; sections: DraftSection[] } = {
  title: 'Soot on the Sarvel: extra summer melt',
  summary:
    'If soot from the valley settlements keeps settling on the snow and ice of the Upper Sarvel, the glacier catchment ' +
    'gives **more melt water** over the summer than it would with clean surfaces. The chart shows in which months the ' +
    'extra water arrives; the table gives the season totals.',
  sections: [
    { kind: 'chart', heading: 'When the extra water arrives', caption: 'Added runoff by month, soot scenario against the baseline.', contentKey: 'monthly-added-melt' },
    { kind: 'table', heading: 'Season totals', caption: 'April to September 2024, whole catchment.', contentKey: 'totals' },
    {
      kind: 'text', heading: 'What this means for Duskwater',
      bodyMarkdown:
        'Darker snow and ice absorb more sunlight, so they melt sooner and faster. For the intake below the Sarvel this means:\n\n' +
        '- more water over the **whole melt season**, most of it in the months with the tallest bars in the chart above;\n' +
        '- the melt water arriving earlier in the year (the timing shift in the headline numbers says by how many days).\n\n' +
        'These are scenario estimates from synthetic demo data, not a forecast. We suggest checking them against the gauge ' +
        'record before planning on the extra water.',
    },
  ],
};
