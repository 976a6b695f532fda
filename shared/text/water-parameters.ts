import { type AVALANCHE_PARAMETERS } from '../hydrology/avalanche';
import { type GLACIER_DAMPING_PARAMETERS } from '../hydrology/glacier-air-temperature';
import { type VOLUME_AREA } from '../hydrology/glacier-volume';
import { type PROFILE_PARAMETERS } from '../hydrology/precipitation-profile';
import { type ROUTING_PARAMETERS } from '../hydrology/runoff-routing';

/** Plain names of the water side's parameters, for forms, tables and exports. */
export const AVALANCHE_LABELS: Record<keyof typeof AVALANCHE_PARAMETERS, string> = {
  holdingCoefficient: 'Holding depth coefficient c (SHD = c·slope^e)',
  holdingExponent: 'Holding depth exponent e',
  minimumHoldingDepthM: 'Least snow depth a slope holds',
  snowDensityKgM3: 'Snow density for the holding capacity',
};

export const ROUTING_LABELS: Record<keyof typeof ROUTING_PARAMETERS, string> = {
  iceStorageHours: 'Storage time of bare-ice melt',
  snowRainStorageHours: 'Storage time of snow melt and rain',
  debrisIceStorageHours: 'Storage time of melt under debris',
  groundwaterStorageDays: 'Storage time of groundwater',
  groundwaterShareSnow: 'Share of snow melt to groundwater',
  groundwaterShareRain: 'Share of rain to groundwater',
  groundwaterShareIce: 'Share of bare-ice melt to groundwater',
  groundwaterShareDebrisIce: 'Share of melt under debris to groundwater',
};

export const DAMPING_LABELS: Record<keyof typeof GLACIER_DAMPING_PARAMETERS, string> = {
  lengthScaleM: 'Katabatic length scale L = H/CH',
  flowlineGradient: 'Mean surface slope along the glacier (dz/dx)',
};

export const PROFILE_LABELS: Record<keyof typeof PROFILE_PARAMETERS, string> = {
  gradientPerKm: 'Precipitation increase per km',
  peakElevationM: 'Elevation of the precipitation maximum',
  gradientBelowPerKm: 'Increase below the maximum, per km',
  decreaseAbovePerKm: 'Decrease above the maximum, per km',
};

export const VOLUME_AREA_LABELS: Record<keyof typeof VOLUME_AREA, string> = {
  coefficientKm: 'Volume–area coefficient c',
  exponent: 'Volume–area exponent γ',
};
