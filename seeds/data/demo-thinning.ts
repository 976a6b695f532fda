import { HUSS_DENSITY } from '../../shared/geodata/elevation-change';
import { DEMO_THINNING_PERIOD, type DemoThinningBand } from '../../shared/geodata/demo/demo-valley';
import { siteWith } from '../../shared/lab/calibration-set';
import { compareGeodetic } from '../../shared/lab/geodetic-skill';
import { DEMO_BANDS } from './demo-catchment';
import { demoEngineInput } from './demo-forcing';
import { DEMO_TRUTH } from './demo-truth';

/**
 * Share of a band's departure from the glacier-wide balance that ice flow gives back: emergence
 * below the equilibrium line, submergence above it (dh/dt = ḃ/ρ + w, the kinematic boundary
 * condition; Cuffey & Paterson 2010, ch. 8). Invented for the demo; it flattens the thinning
 * profile against the surface balance and leaves the glacier-wide mean as it is, since the ice
 * flux integrates to zero over the glacier.
 */
const FLOW_SHARE = 0.6;

/**
 * What the demo's thinning map shows, made consistent with the model like its discharge and
 * stakes: the surface balance of each glacier band in the engine run with the hidden DEMO_TRUTH
 * parameters over the record's years (standing for the survey period), pulled towards the glacier-wide mean by ice flow, and
 * turned into surface elevation change with the density the product assumes (850 kg m⁻³).
 */
export function demoThinning(): DemoThinningBand[] {
  const truth = siteWith(demoEngineInput(), DEMO_TRUTH);
  const glacierBands = DEMO_BANDS.filter((b) => b.glacierFraction > 0);
  const { rows, glacierWide } = compareGeodetic(truth, glacierBands.map((b) => ({
    ...DEMO_THINNING_PERIOD, lowerM: b.lowerM, upperM: b.upperM, glacierAreaKm2: b.areaKm2 * b.glacierFraction, balanceMwePerYear: 0, sigmaMwePerYear: 0,
  })));
  const mean = glacierWide.simulatedMwePerYear;
  const toIce = 1000 / HUSS_DENSITY.valueKgM3;
  return rows.map((r) => ({
    lowerM: r.lowerM, upperM: r.upperM,
    dhdtMPerYear: (r.simulatedMwePerYear - FLOW_SHARE * (r.simulatedMwePerYear - mean)) * toIce,
  }));
}
