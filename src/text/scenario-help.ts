/** Help text beside the scenario builder's fields, with the source of each range. */
export const SCENARIO_HELP = {
  blackCarbonSnow: 'Added to the catchment\'s background in fresh snow (set on the catchment). Remote snow holds tens of ng/g; polluted Himalayan glaciers up to thousands (Gul et al. 2022, ACP 22:8725). The load is enriched at the surface as the snow melts (Flanner et al. 2007).',
  blackCarbonIce: 'A sensitivity you set: bare-ice darkening follows the ice darkening parameters, kept within published dirty-ice albedo (Cuffey & Paterson 2010), not a measured response of this glacier.',
  dustSnow: 'Added to the catchment\'s background in fresh snow. Up to ~100 µg/g on polluted glaciers (Gul et al. 2022). Carried as black-carbon equivalent through the dust absorption ratio.',
  dustIce: 'A sensitivity you set, as black carbon on ice; dust is carried as black-carbon equivalent through the dust absorption ratio.',
  deposition: 'Dry deposition onto the snow surface between snowfalls; it stays at the surface until new snow buries it, and is enriched as the snow melts.',
  debrisThickness: 'Added to every band\'s mean debris thickness. Thin debris (below a few cm) speeds melt, thick debris slows it (Østrem 1959).',
  debrisExtent: 'Share of each band\'s clean glacier ice that becomes debris-covered, 0–1.',
  temperature: 'Added to the station record (delta change). Global warming levels are above 1850–1900 (IPCC AR6); the preset subtracts the ≈1.09 °C already in a 2011–2020 record (IPCC AR6 WGI, SPM A.1.2). Mountains often warm faster: edit the value for the region.',
  precipitation: 'Multiplies the station precipitation; 1 = unchanged.',
  period: 'The days reported; the run first spins up through the record before them. A melt season is typical. Must lie inside the stored climate record.',
} as const;
