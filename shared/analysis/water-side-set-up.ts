import { DEFAULT_ROUTING_PARAMETERS } from '../hydrology/runoff-routing';
import { DEFAULT_AVALANCHE_PARAMETERS } from '../hydrology/avalanche';
import { formatNumber } from '../text/numbers';
import { lapseRateText, profileText } from '../text/water-side';
import type { RunWaterSide } from './water-side-inputs';

const range = (values: readonly number[], text: (v: number) => string) => {
  const lo = Math.min(...values);
  const hi = Math.max(...values);
  return lo === hi ? text(lo) : `${text(lo)} to ${text(hi)}`;
};
const count = (origins: readonly string[], origin: string) => origins.filter((o) => o === origin).length;
const months = (n: number) => `${n} month${n === 1 ? '' : 's'}`;

function bandClimateLine(side: RunWaterSide): string {
  const g = side.water.gradients;
  if (!g) return 'From the model parameters: one lapse rate and a linear precipitation gradient above the reference station.';
  const fitted = count(g.origin.lapseRate, 'fitted');
  const hand = count(g.origin.lapseRate, 'set by hand');
  const how = [`${months(fitted)} fitted`, ...(hand ? [`${months(hand)} set by hand`] : []), ...(12 - fitted - hand ? [`${months(12 - fitted - hand)} assumed, not fitted`] : [])].join(', ');
  const profiles = [...new Set(g.profiles.map(profileText))];
  const profileOrigins = [...new Set(g.origin.profile)].join(', ');
  return `From ${g.origin.stationCount} station${g.origin.stationCount === 1 ? '' : 's'}: lapse rate ${range(g.lapseRatesKPerKm, lapseRateText)} over the year (${how}); `
    + `precipitation ${profiles.length === 1 ? profiles[0] : `${profiles.length} monthly profiles`} (${profileOrigins})`
    + `${g.damping ? '; air over snow-free glacier ice damped by the katabatic layer (Greuell & Böhm 1998)' : ''}.`;
}

function precipitationLine(side: RunWaterSide): string {
  const c = side.water.closure;
  if (!side.waterBalancePrecipitation || !c) return 'The station record, times the scenario\'s precipitation factor.';
  const when = c.period ? ` over ${c.period.from} to ${c.period.to}` : '';
  const who = c.savedBy && c.savedAt ? `, kept by ${c.savedBy} on ${c.savedAt.slice(0, 10)}` : '';
  const ratio = c.ratio !== undefined ? ` (${formatNumber(c.ratio, 2)} × the station precipitation over the catchment)` : '';
  return `The water-balance precipitation closed against the measured runoff${when}${who}: factor ${formatNumber(c.precipitationFactor, 2)} on the station record, ${profileText(c.profile)}${ratio}; a variant's precipitation change applies on top of it.`;
}

function redistributionLine(side: RunWaterSide): string {
  const r = side.water.redistribution;
  if (!r || (!r.avalanche && !r.windDrift)) return 'Off: each band keeps the snow that falls on it.';
  const parts: string[] = [];
  if (r.windDrift) parts.push(`wind drift of fresh snow by an accumulation factor per band (${range(r.windDrift.factors, (v) => formatNumber(v, 2))})`);
  if (r.avalanche) {
    const p = { ...DEFAULT_AVALANCHE_PARAMETERS, ...r.avalanche.parameters };
    parts.push(`avalanching of snow above the slope's holding depth to the bands below (Bernhardt & Schulz 2010; minimum holding depth ${formatNumber(p.minimumHoldingDepthM, 2)} m, snow density ${formatNumber(p.snowDensityKgM3, 0)} kg/m³)`);
  }
  return `On, conserving mass: ${parts.join('; ')}.`;
}

function routingLine(side: RunWaterSide): string {
  if (!side.water.routing) return 'Off: the outlet discharge is each day\'s melt and rain.';
  const p = { ...DEFAULT_ROUTING_PARAMETERS, ...side.water.routing.parameters };
  return `Linear reservoirs (Hock & Noetzli 1997): bare-ice melt ${formatNumber(p.iceStorageHours, 0)} h, melt under debris ${formatNumber(p.debrisIceStorageHours, 0)} h, `
    + `snow melt and rain ${formatNumber(p.snowRainStorageHours, 0)} h, groundwater ${formatNumber(p.groundwaterStorageDays, 0)} days `
    + `(shares to groundwater: snow ${formatNumber(p.groundwaterShareSnow, 2)}, rain ${formatNumber(p.groundwaterShareRain, 2)}, ice ${formatNumber(p.groundwaterShareIce, 2)}, under debris ${formatNumber(p.groundwaterShareDebrisIce, 2)}). `
    + 'Skill scores use the routed discharge; added runoff is counted as it leaves the bands.';
}

/** The water side of a run as label–value lines for its set-up (screens, exports, briefings); none for runs made before it was recorded. */
export function waterSideLines(side: RunWaterSide | null): { label: string; value: string }[] {
  if (!side) return [];
  return [
    { label: 'Band temperature and precipitation', value: bandClimateLine(side) },
    { label: 'Precipitation', value: precipitationLine(side) },
    { label: 'Snow redistribution', value: redistributionLine(side) },
    { label: 'Runoff routing', value: routingLine(side) },
  ];
}
