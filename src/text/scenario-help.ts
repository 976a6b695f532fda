/** Help text beside the scenario builder's fields, with the source of each range. */
export const SCENARIO_HELP = {
  blackCarbonSnow: 'Remote snow holds tens of ng/g; polluted Himalayan glaciers up to thousands (Gul et al. 2022, ACP 22:8725). 3–30 ng/g lowers melting-snow albedo 0–3 % (Warren 2013, JGR 118:779).',
  blackCarbonIce: 'Bare-ice darkening by impurities follows a user-set rule (see the ice darkening parameters); it is not a published parameterisation.',
  dust: 'Up to ~100 µg/g on polluted glaciers (Gul et al. 2022). Dust is carried as black-carbon equivalent through the dust absorption ratio.',
  debrisThickness: 'Added to every band\'s mean debris thickness. Thin debris (below a few cm) speeds melt, thick debris slows it (Østrem 1959).',
  debrisExtent: 'Share of each band\'s clean glacier ice that becomes debris-covered, 0–1.',
  temperature: 'Added to the station record (delta change). Global warming levels are above 1850–1900 (IPCC AR6); the preset subtracts the ≈1.09 °C already in a 2011–2020 record [memory]. Mountains often warm faster: edit the value for the region.',
  precipitation: 'Multiplies the station precipitation; 1 = unchanged.',
  period: 'The days simulated; a melt season is typical. Must lie inside the stored climate record.',
} as const;
