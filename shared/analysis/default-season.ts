/**
 * The melt season a new scenario starts with: the latest full April–September (northern
 * hemisphere) or October–March (southern) inside the climate record, else the whole record.
 * Dates are YYYY-MM-DD; the user can change the period.
 */
export function defaultSeason(record: { from: string; to: string }, latitudeDeg: number): { from: string; to: string } {
  const lastYear = Number(record.to.slice(0, 4));
  for (let year = lastYear; year >= Number(record.from.slice(0, 4)) - 1; year--) {
    const season = latitudeDeg >= 0
      ? { from: `${year}-04-01`, to: `${year}-09-30` }
      : { from: `${year}-10-01`, to: `${year + 1}-03-31` };
    if (season.from >= record.from && season.to <= record.to) return season;
  }
  return record;
}
