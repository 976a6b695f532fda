import type { GeodeticComparisonReply, SnowCoverComparisonReply } from '../schemas/lab-remote-sensing';
import { roundTo } from '../text/numbers';
import { formatDate, formatPeriod } from '../text/format';
import type { ChartSpec } from './chart-spec';
import { axisNameAlong, legendAndGrid } from './chart-style';
import { profileChart } from './geodata-charts';
import { GUIDE_GREY, lineStyle } from './palette';

/** Mapped against simulated snow-covered fraction (%), one point per band and map date, with the 1:1 line. */
export function snowCoverSkillChart(r: SnowCoverComparisonReply): ChartSpec {
  const dates = [...new Set(r.pairs.map((p) => p.date))];
  return {
    option: {
      tooltip: { trigger: 'item' },
      ...legendAndGrid([...dates.map(formatDate), '1:1']),
      xAxis: { type: 'value', ...axisNameAlong('Mapped snow-covered fraction (%)', 'x'), min: 0, max: 100 },
      yAxis: { type: 'value', ...axisNameAlong('Simulated (%)', 'y'), min: 0, max: 100 },
      series: [
        ...dates.map((date, i) => ({
          name: formatDate(date), type: 'scatter', ...lineStyle(i),
          data: r.pairs.filter((p) => p.date === date).map((p) => ({ value: [roundTo(p.snowCoveredFraction * 100, 1), roundTo(p.simulatedFraction * 100, 1)], name: `${p.lowerM}–${p.upperM} m` })),
        })),
        { name: '1:1', type: 'line', showSymbol: false, data: [[0, 0], [100, 100]], lineStyle: { type: 'dashed', color: GUIDE_GREY }, itemStyle: { color: GUIDE_GREY } },
      ],
    },
    table: {
      columns: [{ name: 'date', label: 'Map date' }, { name: 'band', label: 'Band' }, { name: 'obs', label: 'Mapped (%)' }, { name: 'sim', label: 'Simulated (%)' }, { name: 'seen', label: 'Seen (% of band)' }],
      rows: r.pairs.map((p) => ({ date: p.date, band: `${p.lowerM}–${p.upperM} m`, obs: roundTo(p.snowCoveredFraction * 100, 1), sim: roundTo(p.simulatedFraction * 100, 1), seen: roundTo(p.validFraction * 100, 1) })),
    },
  };
}

/** Geodetic (± 1 σ) and simulated balance profile: m w.e. per year against band elevation. */
export function geodeticSkillChart(r: GeodeticComparisonReply): ChartSpec {
  const mid = (x: { lowerM: number; upperM: number }) => (x.lowerM + x.upperM) / 2;
  return {
    option: profileChart('Balance (m w.e. per year)', [
      { name: r.rows[0] ? `Geodetic ${formatPeriod(r.rows[0].fromDate, r.rows[0].toDate)}` : 'Geodetic', type: 'line', data: r.rows.map((x) => [roundTo(x.balanceMwePerYear, 3), mid(x)]), ...lineStyle(0, true) },
      {
        name: 'Geodetic ± 2 σ', type: 'scatter', symbolSize: 4, itemStyle: { color: GUIDE_GREY },
        data: r.rows.flatMap((x) => [[roundTo(x.balanceMwePerYear - 2 * x.sigmaMwePerYear, 3), mid(x)], [roundTo(x.balanceMwePerYear + 2 * x.sigmaMwePerYear, 3), mid(x)]]),
      },
      { name: `Simulated ${formatPeriod(r.period.from, r.period.to)}`, type: 'line', data: r.rows.map((x) => [roundTo(x.simulatedMwePerYear, 3), mid(x)]), ...lineStyle(1) },
    ]),
    table: {
      columns: [{ name: 'band', label: 'Band' }, { name: 'obs', label: 'Geodetic (m w.e. per year)' }, { name: 'sigma', label: '± 1 σ' }, { name: 'sim', label: 'Simulated (m w.e. per year)' }],
      rows: r.rows.map((x) => ({ band: `${x.lowerM}–${x.upperM} m`, obs: roundTo(x.balanceMwePerYear, 3), sigma: roundTo(x.sigmaMwePerYear, 3), sim: roundTo(x.simulatedMwePerYear, 3) })),
    },
  };
}
