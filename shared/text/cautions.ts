/**
 * The cautions shown with every run result, in every briefing and every export
 * (docs/design.md, "Cautions the product shows"). One place, so all copies agree.
 */
export const CAUTIONS: readonly string[] = [
  'These results are scenario estimates, not forecasts.',
  'They depend on sparse station data and on model parameters whose published ranges are wide.',
  'They are no substitute for site measurements, hydrological design standards, or the judgement of licensed engineers and local authorities; follow local codes and licensed practice.',
  'Glacier hazards (outburst floods, surges, avalanches) are outside the model.',
  'Extra melt from darkening draws down stored snow and ice; in the long run it is not new water.',
];

/** Shown wherever a run darkens bare ice: the rule is the analyst's assumption, not a measured response. */
export const ICE_DARKENING_CAUTION =
  'Darkening of bare glacier ice is a sensitivity set by the analyst: the ice loads and the albedo each lowers them by are assumptions '
  + 'kept within published dirty-ice albedo observations, not a measured response of this glacier.';

/** Shown with every run whose parameters were never calibrated against the catchment's observations. */
export const CALIBRATION_HEADING = 'Calibration';

export const CAUTIONS_HEADING = 'Cautions';
