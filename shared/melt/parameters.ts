/**
 * Model parameters: defaults, allowed ranges and where each value comes from, so the product can
 * show them beside every input. "[memory]" marks values recalled rather than read in the source;
 * "assumption" marks choices of this engine.
 */

export interface ParameterSpec {
  default: number;
  min: number;
  max: number;
  unit: string;
  source: string;
}

export const PARAMETER_SPECS = {
  lapseRateCPerKm: { default: -6.5, min: -10, max: -2, unit: '°C km⁻¹', source: 'ICAO standard atmosphere −6.5; glacier ablation seasons often ≈ −5 (Gardner et al. 2009, J. Climate)' },
  precipitationGradientPerKm: { default: 0.5, min: 0, max: 2, unit: 'fraction km⁻¹', source: 'relative increase of precipitation with elevation; common practice in Alpine catchment models, 2–10 % per 100 m [memory]' },
  rainSnowThresholdC: { default: 1, min: -0.4, max: 2.4, unit: '°C', source: 'Jennings et al. 2018, Nat. Commun.: mean ≈ 1 °C, 95 % of stations −0.4 … 2.4 °C' },
  rainSnowTransitionK: { default: 2, min: 0, max: 4, unit: 'K', source: 'width of the linear rain/snow mix centred on the threshold; common practice [memory]' },
  transmissivity: { default: 0.75, min: 0.6, max: 0.9, unit: '-', source: 'clear-sky transmissivity ψa, Hock 1999 (J. Glaciol. 45:101) [memory]' },
  diffuseFraction: { default: 0.15, min: 0.05, max: 0.3, unit: '-', source: 'clear-sky diffuse share of global radiation, Erbs et al. 1982: 0.15–0.2 [memory]' },
  terrainAlbedo: { default: 0.3, min: 0, max: 0.9, unit: '-', source: 'albedo of surrounding terrain reflecting onto slopes; assumption (mixed rock and snow)' },
  defaultCloudiness: { default: 0.3, min: 0, max: 1, unit: '-', source: 'cloudiness used when the forcing has none; assumption, set it for the site' },
  defaultWindMs: { default: 2, min: 0.1, max: 10, unit: 'm s⁻¹', source: 'wind speed used when the forcing has none; assumption' },
  defaultRelativeHumidity: { default: 0.7, min: 0.05, max: 1, unit: '-', source: 'relative humidity used when the forcing has none; assumption' },
  exchangeCoefficient: { default: 0.002, min: 0.001, max: 0.005, unit: '-', source: 'bulk transfer coefficient CH over glaciers, 1–5·10⁻³ [memory]' },
  freshGrainRadiusUm: { default: 60, min: 30, max: 150, unit: 'µm', source: 'fresh snow grain radius 50–100 µm (Gardner & Sharp 2010; Warren 2013) [memory]' },
  maxGrainRadiusUm: { default: 1500, min: 500, max: 3000, unit: 'µm', source: 'upper bound of grain radius in old melting snow ≈ 1000–1500 µm [memory]' },
  dryGrainGrowthMm3PerDay: { default: 1.1e-4, min: 1e-5, max: 1e-3, unit: 'mm³ d⁻¹', source: 'grain volume growth in cold snow; assumption giving ≈ 60 → 100 µm in a cold month' },
  wetGrainGrowthMm3PerDay: { default: 0.02, min: 0.002, max: 0.05, unit: 'mm³ d⁻¹', source: 'wet-snow grain volume growth, Brun 1989 (Ann. Glaciol. 13:22) 1.28·10⁻⁸ + 4.22·10⁻¹⁰ θ³ mm³ s⁻¹ with liquid water θ ≈ 8 % [memory]; gives ≈ 100 → 500 µm in three weeks of melt' },
  snowSurfaceLayerMm: { default: 5, min: 1, max: 50, unit: 'mm w.e.', source: 'mass of surface snow whose grains fresh snowfall mixes with; assumption' },
  dustToBlackCarbon: { default: 0.005, min: 0.001, max: 0.02, unit: '-', source: 'light absorption of dust per unit mass relative to black carbon ≈ 1/200 [memory]' },
  iceAlbedo: { default: 0.34, min: 0.25, max: 0.51, unit: '-', source: 'clean ice 0.34 (Oerlemans & Knap 1998, J. Glaciol. 44:231); range 0.34–0.51 (Paterson 1994 Table 4.1) [memory]' },
  iceAlbedoFloor: { default: 0.15, min: 0.05, max: 0.3, unit: '-', source: 'lowest bare-ice albedo from impurities; dirty ice 0.15–0.25 (Paterson 1994 Table 4.1) [memory]' },
  iceAlbedoBlackCarbonSlope: { default: 0.05, min: 0, max: 0.3, unit: 'per 1000 ng g⁻¹', source: 'user-set rule for impurity darkening of bare ice; assumption, not a published parameterisation' },
  iceAlbedoDustSlope: { default: 0.05, min: 0, max: 0.3, unit: 'per 100 µg g⁻¹', source: 'user-set rule for impurity darkening of bare ice; assumption, not a published parameterisation' },
  iceSurfaceLayerMm: { default: 100, min: 10, max: 1000, unit: 'mm w.e.', source: 'mass of bare ice whose cold content must be repaid before melt; assumption' },
  debrisAlbedo: { default: 0.15, min: 0.05, max: 0.3, unit: '-', source: 'debris albedo 0.1–0.3 (Nicholson & Benn 2006) [memory]; debris-covered ice 0.10–0.15 (Paterson 1994) [memory]' },
  debrisConductivity: { default: 0.9, min: 0.5, max: 1.5, unit: 'W m⁻¹ K⁻¹', source: 'effective debris conductivity 0.5–1.5 (Nicholson & Benn 2006) [memory]' },
  debrisEmissivity: { default: 0.95, min: 0.85, max: 1, unit: '-', source: 'debris emissivity ≈ 0.95 (Nicholson & Benn 2006) [memory]' },
  minDebrisThicknessM: { default: 0.005, min: 0.001, max: 0.05, unit: 'm', source: 'thinnest debris the conduction model uses; thinner covers are raised to it; assumption' },
  newDebrisThicknessM: { default: 0.05, min: 0.005, max: 1, unit: 'm', source: 'thickness given to newly debris-covered ice in a band without debris; assumption' },
  degreeDaySnow: { default: 4, min: 2.5, max: 11.6, unit: 'mm d⁻¹ K⁻¹', source: 'degree-day factor for snow, Hock 2003 (J. Hydrol. 282:104) range 2.5–11.6 [memory]' },
  degreeDayIce: { default: 8, min: 6.6, max: 20, unit: 'mm d⁻¹ K⁻¹', source: 'degree-day factor for ice ≈ 8 (Braithwaite 1995); range 6.6–20 (Hock 2003) [memory]' },
  debrisHalfThicknessM: { default: 0.066, min: 0.01, max: 0.3, unit: 'm', source: 'H* of the hyperbolic debris reduction ḃ0 H*/(H* + h), Anderson & Anderson 2016 (TC 10:1105) [memory]' },
  etiTemperatureFactor: { default: 0.05, min: 0.01, max: 0.1, unit: 'mm h⁻¹ °C⁻¹', source: 'TF, Pellicciotti et al. 2005 (J. Glaciol. 51:573) [memory]' },
  etiShortwaveFactor: { default: 0.0094, min: 0.002, max: 0.02, unit: 'm² mm W⁻¹ h⁻¹', source: 'SRF, Pellicciotti et al. 2005 [memory]' },
  etiThresholdC: { default: 1, min: -2, max: 3, unit: '°C', source: 'melt threshold TT, Pellicciotti et al. 2005 [memory]' },
} as const satisfies Record<string, ParameterSpec>;

export type ParameterName = keyof typeof PARAMETER_SPECS;
export type Parameters = Record<ParameterName, number>;

export const PARAMETER_NAMES = Object.keys(PARAMETER_SPECS) as ParameterName[];

/** Default value of every parameter. */
export const DEFAULT_PARAMETERS: Readonly<Parameters> = Object.freeze(
  Object.fromEntries(PARAMETER_NAMES.map((name) => [name, PARAMETER_SPECS[name].default])) as Parameters,
);

/** Allowed range, unit and source of every parameter, for forms and ensembles. */
export const PARAMETER_RANGES: Readonly<Record<ParameterName, Omit<ParameterSpec, 'default'>>> = Object.freeze(
  Object.fromEntries(PARAMETER_NAMES.map((name) => {
    const { min, max, unit, source } = PARAMETER_SPECS[name];
    return [name, { min, max, unit, source }];
  })) as Record<ParameterName, Omit<ParameterSpec, 'default'>>,
);
