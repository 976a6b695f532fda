/// <reference lib="dom" />
import { createRequire } from 'node:module';
import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';

// axe-core's browser build, evaluated in the page through the debugging protocol (the app's CSP refuses inline script tags).
const AXE_SOURCE = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');

export type AxeImpact = 'critical' | 'serious' | 'moderate' | 'minor';

export interface AxeFinding {
  id: string;
  impact: AxeImpact;
  help: string;
  nodes: { target: string; summary: string }[];
}

export interface AxeReport {
  counts: Record<AxeImpact, number>;
  findings: AxeFinding[];
}

/** Runs axe-core (WCAG 2.0–2.2 A and AA rules and best practice) on what the page shows now. */
export async function checkAccessibility(page: Page): Promise<AxeReport> {
  const loaded = await page.evaluate(() => typeof (window as unknown as { axe?: unknown }).axe !== 'undefined');
  if (!loaded) await page.evaluate(AXE_SOURCE);
  const violations = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run(ctx: unknown, opts: unknown): Promise<{ violations: { id: string; impact: string; help: string; nodes: { target: string[]; failureSummary?: string }[] }[] }> } }).axe;
    const result = await axe.run(document, {
      runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa', 'best-practice'] },
      resultTypes: ['violations'],
    });
    return result.violations.map((v) => ({
      id: v.id, impact: v.impact, help: v.help,
      nodes: v.nodes.map((n) => ({ target: n.target.join(' '), summary: n.failureSummary ?? '' })),
    }));
  });
  const counts: Record<AxeImpact, number> = { critical: 0, serious: 0, moderate: 0, minor: 0 };
  for (const v of violations) counts[v.impact as AxeImpact] += v.nodes.length;
  return { counts, findings: violations as AxeFinding[] };
}

/** The critical and serious findings, one line each, for an assertion message. */
export function blockingFindings(report: AxeReport): string[] {
  return report.findings
    .filter((f) => f.impact === 'critical' || f.impact === 'serious')
    .flatMap((f) => f.nodes.map((n) => `${f.impact} ${f.id}: ${n.target} — ${n.summary.split('\n').slice(1, 2).join('').trim()}`));
}
