/**
 * Model parameters: defaults, allowed ranges and where each value comes from, so the product can
 * show them beside every input. "[memory]" marks values recalled rather than read in the source;
 * "assumption" marks choices of this engine. Users see the source without these tags.
 */

export interface ParameterSpec {
  default: number;
  min: number;
  max: number;
  unit: string;
  source: string;
}

/** An engine parameter: with the plain name forms, tables, PDFs and CSV headers show. */
export interface LabelledParameterSpec extends ParameterSpec {
  label: string;
}

export const PARAMETER_SPECS = {
  lapseRateCPerKm: { label: 'Temperature lapse rate', default: -6.5, min: -10, max: -2, unit: '°C km⁻¹', source: 'ICAO standard atmosphere −6.5; glacier ablation seasons often ≈ −5 (Gardner et al. 2009, J. Climate)' },
  precipitationGradientPerKm: { label: 'Precipitation increase with elevation', default: 0.5, min: 0, max: 2, unit: 'fraction km⁻¹', source: 'relative increase of precipitation with elevation; common practice in Alpine catchment models, 2–10 % per 100 m [memory]' },
  rainSnowThresholdC: { label: 'Rain/snow threshold temperature', default: 1, min: -0.4, max: 2.4, unit: '°C', source: 'Jennings et al. 2018, Nat. Commun.: mean ≈ 1 °C, 95 % of stations −0.4 … 2.4 °C' },
  rainSnowTransitionK: { label: 'Rain/snow transition width', default: 2, min: 0, max: 4, unit: 'K', source: 'width of the linear rain/snow mix centred on the threshold; common practice [memory]' },
  turbidity: { label: 'Air turbidity (clear-sky model)', default: 1, min: 0.5, max: 1, unit: '-', source: 'turbidity coefficient Kt of the ASCE-EWRI 2005 clear-sky model (Allen et al. 2005): 1 for clean air, 0.5 for extremely turbid, dusty or polluted air' },
  temperatureRangeRadiationCoefficient: { label: 'Radiation from the daily temperature range (kRs)', default: 0.16, min: 0.1, max: 0.25, unit: '°C⁻½', source: 'kRs of FAO-56 Eq. 50 (Hargreaves; Allen et al. 1998): ≈ 0.16 interior, 0.19 coastal sites; used when neither radiation nor cloudiness is measured' },
  terrainAlbedo: { label: 'Albedo of surrounding terrain', default: 0.3, min: 0, max: 0.9, unit: '-', source: 'albedo of surrounding terrain reflecting onto slopes; assumption (mixed rock and snow)' },
  defaultCloudiness: { label: 'Fixed cloudiness, when chosen', default: 0.3, min: 0, max: 1, unit: '-', source: 'cloudiness used when the run is told to assume a fixed cloudiness; assumption, set it for the site' },
  defaultWindMs: { label: 'Wind speed when none is stored', default: 2, min: 0.1, max: 10, unit: 'm s⁻¹', source: 'wind speed used when the forcing has none; assumption' },
  defaultRelativeHumidity: { label: 'Relative humidity when none is stored', default: 0.7, min: 0.05, max: 1, unit: '-', source: 'relative humidity used when the forcing has none; assumption' },
  exchangeCoefficient: { label: 'Bulk transfer coefficient over snow and ice', default: 0.002, min: 0.001, max: 0.005, unit: '-', source: 'neutral bulk transfer coefficient CH for heat and vapour over snow and ice at 2 m, 1–5·10⁻³ [memory]' },
  debrisRoughnessM: { label: 'Debris roughness length', default: 0.016, min: 0.001, max: 0.1, unit: 'm', source: 'aerodynamic roughness length of debris cover, 0.016 m measured on a Himalayan debris-covered glacier (Rounce et al. 2015) [memory]' },
  freshGrainRadiusUm: { label: 'Fresh snow grain radius', default: 60, min: 30, max: 150, unit: 'µm', source: 'fresh snow grain radius 50–100 µm (Gardner & Sharp 2010; Warren 2013) [memory]' },
  maxGrainRadiusUm: { label: 'Largest snow grain radius', default: 1500, min: 500, max: 3000, unit: 'µm', source: 'upper bound of grain radius in old melting snow ≈ 1000–1500 µm [memory]' },
  dryGrainGrowthMm3PerDay: { label: 'Grain growth in cold snow', default: 5e-4, min: 5e-5, max: 2e-3, unit: 'mm³ d⁻¹', source: 'grain volume growth in cold dry snow, giving ≈ 60 → 130 µm in two weeks, as the decline of specific surface area in cold seasonal snow shows (Taillandier et al. 2007) [memory]' },
  wetGrainGrowthMm3PerDay: { label: 'Grain growth in wet snow', default: 0.14, min: 0.02, max: 0.3, unit: 'mm³ d⁻¹', source: 'wet-snow grain volume growth, Brun 1989 (Ann. Glaciol. 13:22) 1.28·10⁻⁸ + 4.22·10⁻¹⁰ θ³ mm³ s⁻¹ for liquid water θ of 8–16 % [memory]; set so clean melting summer snow ages as the albedo records of Oerlemans & Knap 1998 show (tested)' },
  snowSurfaceLayerMm: { label: 'Snow surface layer', default: 20, min: 5, max: 50, unit: 'mm w.e.', source: 'mass of surface snow whose grains fresh snowfall mixes with and whose impurities melt enriches; the top 2–5 cm sampled in field studies (Doherty et al. 2013) [memory]' },
  snowDensityKgM3: { label: 'Snow density', default: 350, min: 100, max: 550, unit: 'kg m⁻³', source: 'mean density of the seasonal pack, for snow depth and conductivity; 200–500 common practice' },
  thinSnowDepthM: { label: 'Thin-snow depth scale', default: 0.032, min: 0.01, max: 0.1, unit: 'm', source: 'snow-depth scale d* of the thin-snow effect over ice, 3.2 cm (Oerlemans & Knap 1998)' },
  liquidWaterHoldingFraction: { label: 'Liquid water the snow holds', default: 0.05, min: 0.01, max: 0.1, unit: '-', source: 'liquid water the pack holds before it drains, a few % of its mass (common practice)' },
  snowCoverVariation: { label: 'Variation of snow depth within a band', default: 0.5, min: 0.1, max: 1.2, unit: '-', source: 'coefficient of variation of SWE within a band at peak accumulation; Liston 2004 gives 0.06 (forest) to 0.85 (windy alpine) [memory]' },
  scavengingBlackCarbon: { label: 'Black carbon washed out by meltwater', default: 0.2, min: 0.02, max: 1, unit: '-', source: 'share of black carbon carried off by meltwater relative to its concentration, 0.2 hydrophilic, 0.03 hydrophobic (Flanner et al. 2007) [memory]' },
  scavengingDust: { label: 'Dust washed out by meltwater', default: 0.2, min: 0.01, max: 1, unit: '-', source: 'share of dust carried off by meltwater relative to its concentration: 0.2 for the fine dust that darkens snow most, 0.01 for coarse dust (Flanner et al. 2007) [memory]' },
  dustToBlackCarbon: { label: 'Dust absorption relative to black carbon', default: 0.005, min: 0.001, max: 0.02, unit: '-', source: 'light absorption of dust per unit mass relative to black carbon ≈ 1/200 [memory]' },
  iceAlbedo: { label: 'Bare-ice albedo today', default: 0.34, min: 0.25, max: 0.51, unit: '-', source: 'bare-ice albedo of the catchment today, with its background impurities: 0.34 (Oerlemans & Knap 1998, J. Glaciol. 44:231); clean ice 0.34–0.51 (Paterson 1994 Table 4.1) [memory]' },
  iceAlbedoFloor: { label: 'Lowest bare-ice albedo', default: 0.15, min: 0.05, max: 0.3, unit: '-', source: 'lowest bare-ice albedo from added impurities; dirty ice 0.15–0.25 (Paterson 1994 Table 4.1) [memory]' },
  iceAlbedoBlackCarbonSlope: { label: 'Ice darkening by added black carbon (user-set)', default: 0.05, min: 0, max: 0.3, unit: 'per 1000 ng g⁻¹', source: 'user-set sensitivity of bare-ice albedo to added black carbon, not a published parameterisation; the default keeps 1000–2000 ng g⁻¹ inside observed slightly dirty to dirty ice (Paterson 1994; Oerlemans et al. 2009)' },
  iceAlbedoDustSlope: { label: 'Ice darkening by added dust (user-set)', default: 0.05, min: 0, max: 0.3, unit: 'per 100 µg g⁻¹', source: 'user-set sensitivity of bare-ice albedo to added dust, not a published parameterisation; same bounds as for black carbon' },
  debrisAlbedo: { label: 'Debris albedo', default: 0.15, min: 0.05, max: 0.3, unit: '-', source: 'debris albedo 0.1–0.3 (Nicholson & Benn 2006) [memory]; debris-covered ice 0.10–0.15 (Paterson 1994) [memory]' },
  debrisConductivity: { label: 'Debris thermal conductivity', default: 0.9, min: 0.5, max: 1.5, unit: 'W m⁻¹ K⁻¹', source: 'effective debris conductivity 0.5–1.5 (Nicholson & Benn 2006) [memory]' },
  debrisHeatCapacityMJm3K: { label: 'Debris heat capacity', default: 1.4, min: 0.8, max: 2.5, unit: 'MJ m⁻³ K⁻¹', source: 'volumetric heat capacity of the debris layer: rock 2700 kg m⁻³ × 750 J kg⁻¹ K⁻¹ at ≈ 30 % porosity (Reid & Brock 2010) [memory]' },
  debrisEmissivity: { label: 'Debris emissivity', default: 0.95, min: 0.85, max: 1, unit: '-', source: 'debris emissivity ≈ 0.95 (Nicholson & Benn 2006) [memory]' },
  patchyDebrisThicknessM: { label: 'Thickness below which debris is patchy', default: 0.01, min: 0.002, max: 0.05, unit: 'm', source: 'mean thickness below which debris lies in patches over bare ice, giving the rising limb of the Østrem curve (Østrem 1959; Reznichenko et al. 2010) [memory]; assumption of this engine for the exact value' },
  newDebrisThicknessM: { label: 'Thickness of new debris cover', default: 0.05, min: 0.005, max: 1, unit: 'm', source: 'thickness given to newly debris-covered ice in a band without debris; assumption' },
  degreeDaySnow: { label: 'Degree-day factor, snow (reference model)', default: 4, min: 2.5, max: 11.6, unit: 'mm d⁻¹ K⁻¹', source: 'degree-day factor for snow, Hock 2003 (J. Hydrol. 282:104) range 2.5–11.6 [memory]' },
  degreeDayIce: { label: 'Degree-day factor, ice (reference model)', default: 8, min: 6.6, max: 20, unit: 'mm d⁻¹ K⁻¹', source: 'degree-day factor for ice ≈ 8 (Braithwaite 1995); range 6.6–20 (Hock 2003) [memory]' },
  debrisHalfThicknessM: { label: 'Debris half-reduction thickness (reference model)', default: 0.066, min: 0.01, max: 0.3, unit: 'm', source: 'H* of the hyperbolic debris reduction ḃ0 H*/(H* + h), Anderson & Anderson 2016 (TC 10:1105) [memory]' },
  etiTemperatureFactor: { label: 'Temperature factor (reference model)', default: 0.05, min: 0.01, max: 0.1, unit: 'mm h⁻¹ °C⁻¹', source: 'TF, Pellicciotti et al. 2005 (J. Glaciol. 51:573) [memory]' },
  etiShortwaveFactor: { label: 'Shortwave factor (reference model)', default: 0.0094, min: 0.002, max: 0.02, unit: 'm² mm W⁻¹ h⁻¹', source: 'SRF, Pellicciotti et al. 2005 [memory]' },
  etiThresholdC: { label: 'Melt threshold (reference model)', default: 1, min: -2, max: 3, unit: '°C', source: 'melt threshold TT, Pellicciotti et al. 2005 [memory]' },
} as const satisfies Record<string, LabelledParameterSpec>;

export type ParameterName = keyof typeof PARAMETER_SPECS;
export type Parameters = Record<ParameterName, number>;

export const PARAMETER_NAMES = Object.keys(PARAMETER_SPECS) as ParameterName[];

/** Default value of every parameter. */
export const DEFAULT_PARAMETERS: Readonly<Parameters> = Object.freeze(
  Object.fromEntries(PARAMETER_NAMES.map((name) => [name, PARAMETER_SPECS[name].default])) as Parameters,
);

/** Allowed range, unit and source of every parameter, for forms and ensembles. */
export const PARAMETER_RANGES: Readonly<Record<ParameterName, Omit<ParameterSpec, 'default' | 'label'>>> = Object.freeze(
  Object.fromEntries(PARAMETER_NAMES.map((name) => {
    const { min, max, unit, source } = PARAMETER_SPECS[name];
    return [name, { min, max, unit, source }];
  })) as Record<ParameterName, Omit<ParameterSpec, 'default' | 'label'>>,
);

/** Parameters of engine 1.x that 2.0 no longer has; stored scenarios that still name them are cleaned by a migration. */
export const RETIRED_PARAMETER_NAMES = ['transmissivity', 'diffuseFraction', 'iceSurfaceLayerMm', 'minDebrisThicknessM'] as const;

/**
 * A parameter's source as users see it: the citation without the reviewers' tags
 * ("[memory]", "[read]", "[computed]" …), which stay in code and docs.
 *
 * @example plainSource('Hock 2003 range 2.5–11.6 [memory]') // 'Hock 2003 range 2.5–11.6'
 */
export function plainSource(source: string): string {
  return source.replace(/\s*\[(?:memory|read|computed|read form)[^\]]*\]/g, '').replace(/\s{2,}/g, ' ').trim();
}
