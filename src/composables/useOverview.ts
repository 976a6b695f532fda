import { shallowRef } from 'vue';
import { allows } from '@shared/access/capabilities';
import type { Role } from '@shared/schemas/auth';
import type { BillingSummary } from '@shared/schemas/billing';
import type { BriefingListItem } from '@shared/schemas/briefings';
import type { Catchment } from '@shared/schemas/catchments';
import type { LabJob, SavedCalibration } from '@shared/schemas/lab';
import type { Run } from '@shared/schemas/runs';
import { billingApi } from 'src/api/billing';
import { briefingsApi } from 'src/api/briefings';
import { catchmentsApi } from 'src/api/catchments';
import { labApi } from 'src/api/lab';
import { runsApi } from 'src/api/runs';

/** How many catchments, runs, briefings and lab jobs the overview lists. */
const RECENT = 5;

export interface CatchmentWork {
  catchment: Catchment;
  /** Newest runs first. */
  runs: Run[];
  /** The calibration in force; null when none is saved or the role has no lab. */
  calibration: SavedCalibration | null;
}

export interface OverviewWork {
  catchments: CatchmentWork[];
  catchmentTotal: number;
  briefings: BriefingListItem[];
  labJobs: (LabJob & { catchmentName: string })[];
  billing: BillingSummary | null;
}

const newestFirst = <T>(items: T[], at: (item: T) => string) => [...items].sort((a, b) => at(b).localeCompare(at(a)));

/**
 * The work an overview shows, each part only for a role that may read it (the capability table):
 * the most recently changed catchments with their newest runs and calibration, briefings (drafts
 * and published), lab jobs of those catchments and, for admins, the seat plan.
 */
export function useOverview() {
  const work = shallowRef<OverviewWork | null>(null);

  async function load(role: Role): Promise<void> {
    const can = (capability: Parameters<typeof allows>[1]) => allows(role, capability);
    const [list, briefings, billing] = await Promise.all([
      can('readCatchments') ? catchmentsApi.list({ page: 1, perPage: RECENT, sort: 'updatedAt', descending: true, search: '', archived: false }) : null,
      can('readBriefings') ? briefingsApi.list().then((r) => r.briefings) : [],
      can('manageSeats') ? billingApi.summary() : null,
    ]);
    const catchments = await Promise.all((list?.catchments ?? []).map(async (catchment): Promise<CatchmentWork & { jobs: LabJob[] }> => {
      const [runs, calibration, jobs] = await Promise.all([
        can('runScenarios') ? runsApi.runs(catchment.id).then((r) => newestFirst(r.runs, (x) => x.queuedAt).slice(0, 3)) : [],
        can('useLab') ? labApi.calibration(catchment.id).then((r) => r.current) : null,
        can('useLab') ? labApi.jobs(catchment.id).then((r) => r.jobs) : [],
      ]);
      return { catchment, runs, calibration, jobs };
    }));
    work.value = {
      catchments: catchments.map(({ catchment, runs, calibration }) => ({ catchment, runs, calibration })),
      catchmentTotal: list?.total ?? 0,
      briefings: newestFirst(briefings, (b) => b.updatedAt).slice(0, RECENT),
      labJobs: newestFirst(catchments.flatMap((c) => c.jobs.map((j) => ({ ...j, catchmentName: c.catchment.name }))), (j) => j.createdAt).slice(0, RECENT),
      billing,
    };
  }

  return { work, load };
}
