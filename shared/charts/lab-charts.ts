import type { DischargeEvaluationReply, ReferenceModels, StakeSkillReply, SurfaceResponse, SweepResultReply } from '../schemas/lab';
import { roundTo } from '../text/numbers';
import type { ChartSpec } from './chart-spec';
import { GUIDE_GREY, INK, SURFACE_STYLES, seriesColour } from './palette';

const cm = (m: number) => `${roundTo(m * 100, 1)} cm`;
const grid = { left: 64, right: 24, top: 48, bottom: 56 };
const legend = { top: 0, type: 'scroll' as const };

/** Østrem curve: melt under debris against thickness (log axis), with peak, critical thickness and clean ice marked. */
export function ostremChart(r: Pick<SurfaceResponse, 'ostrem'>): ChartSpec {
  const { present, warmer, darker } = r.ostrem;
  const curves = [present, ...warmer, darker];
  const marks = {
    markPoint: {
      symbol: 'circle', symbolSize: 10,
      data: [{ name: 'Peak', coord: [present.peak.thicknessM, present.peak.meltMm], value: `Peak ${cm(present.peak.thicknessM)}, ${roundTo(present.peak.meltMm, 0)} mm` }],
      label: { position: 'right', offset: [2, -14], fontWeight: 'bold' },
    },
    markLine: {
      symbol: 'none',
      data: [
        { yAxis: present.cleanIceMeltMm, label: { formatter: `Clean ice ${roundTo(present.cleanIceMeltMm, 0)} mm`, position: 'insideEndTop' }, lineStyle: { type: 'dashed' } },
        ...(present.criticalThicknessM ? [{ xAxis: present.criticalThicknessM, label: { formatter: `Critical thickness ${cm(present.criticalThicknessM)}` }, lineStyle: { type: 'dotted' } }] : []),
      ],
    },
  };
  return {
    option: {
      tooltip: { trigger: 'axis' },
      legend,
      grid,
      xAxis: { type: 'log', name: 'Debris thickness (m)', nameLocation: 'middle', nameGap: 30, min: 0.005, max: 1 },
      yAxis: { type: 'value', name: 'Ice melt (mm w.e.)', boundaryGap: [0, '15%'] },
      series: curves.map((c, i) => ({
        name: c.label, type: 'line', showSymbol: false, data: c.points.map((p) => [p.thicknessM, roundTo(p.meltMm, 1)]),
        lineStyle: i === 0 ? { width: 3 } : { width: 1.5, type: i === curves.length - 1 ? 'dashed' : 'solid' },
        ...(i === 0 ? marks : {}),
      })),
    },
    table: {
      columns: [{ name: 'h', label: 'Debris thickness (m)' }, ...curves.map((c, i) => ({ name: `c${i}`, label: `${c.label} (mm w.e.)` }))],
      rows: [
        { h: 0, ...Object.fromEntries(curves.map((c, i) => [`c${i}`, roundTo(c.cleanIceMeltMm, 1)])) },
        ...present.points.map((p, k) => ({ h: roundTo(p.thicknessM, 4), ...Object.fromEntries(curves.map((c, i) => [`c${i}`, roundTo(c.points[k].meltMm, 1)])) })),
      ],
    },
  };
}

/** Melt against black carbon (log axis; the clean value, 0 ng/g, is in the table). */
export function impurityChart(r: Pick<SurfaceResponse, 'impurity'>): ChartSpec {
  return {
    option: {
      tooltip: { trigger: 'axis' },
      legend,
      grid,
      xAxis: { type: 'log', name: 'Black carbon (ng/g)', nameLocation: 'middle', nameGap: 30, min: 1, max: 5000 },
      yAxis: { type: 'value', name: 'Melt (mm w.e.)' },
      series: r.impurity.map((c) => ({ name: c.label, type: 'line', showSymbol: true, symbolSize: 4, data: c.points.filter((p) => p.blackCarbonNgG > 0).map((p) => [roundTo(p.blackCarbonNgG, 2), roundTo(p.meltMm, 1)]) })),
    },
    table: {
      columns: [{ name: 'bc', label: 'Black carbon (ng/g)' }, ...r.impurity.map((c) => ({ name: c.surface, label: `${c.label} (mm w.e.)` }))],
      rows: r.impurity[0].points.map((p, k) => ({ bc: roundTo(p.blackCarbonNgG, 2), ...Object.fromEntries(r.impurity.map((c) => [c.surface, roundTo(c.points[k].meltMm, 1)])) })),
    },
  };
}

/** Melt change per °C, side by side: snow, clean ice and debris of several thicknesses (the band's own marked). */
export function warmingChart(r: Pick<SurfaceResponse, 'warming'>): ChartSpec {
  const { warming } = r;
  const pick = [0.01, 0.02, 0.05, 0.1, 0.2, 0.5, 1].map((h) => warming.debris.reduce((best, d) => (Math.abs(Math.log(d.thicknessM / h)) < Math.abs(Math.log(best.thicknessM / h)) ? d : best)));
  const bars = [
    { name: 'Snow', value: warming.snowPerC },
    { name: 'Clean ice', value: warming.cleanIcePerC },
    ...(warming.bandDebris ? [{ name: `Band's debris (${cm(warming.bandDebris.thicknessM)})`, value: warming.bandDebris.perC }] : []),
    ...pick.map((d) => ({ name: `Debris ${cm(d.thicknessM)}`, value: d.perC })),
  ];
  return {
    option: {
      tooltip: { trigger: 'axis' },
      grid: { ...grid, bottom: 90 },
      xAxis: { type: 'category', data: bars.map((b) => b.name), axisLabel: { rotate: 30 } },
      yAxis: { type: 'value', name: 'Melt change (mm w.e. per °C)' },
      series: [{ type: 'bar', data: bars.map((b, i) => ({ value: roundTo(b.value, 1), itemStyle: {
        color: i === 0 ? SURFACE_STYLES.snow.colour : i === 1 ? SURFACE_STYLES.ice.colour : SURFACE_STYLES.debrisIce.colour,
        // The band's own debris in full colour, the other thicknesses lighter.
        opacity: i < 2 || (i === 2 && warming.bandDebris) ? 1 : 0.55,
      } })) }],
    },
    table: {
      columns: [{ name: 'surface', label: 'Surface' }, { name: 'perC', label: 'Melt change (mm w.e. per °C)' }],
      rows: [
        { surface: 'Snow', perC: roundTo(warming.snowPerC, 1) },
        { surface: 'Clean ice', perC: roundTo(warming.cleanIcePerC, 1) },
        ...warming.debris.map((d) => ({ surface: `Debris ${roundTo(d.thicknessM, 4)} m`, perC: roundTo(d.perC, 1) })),
      ],
    },
  };
}

/** Added melt of a sweep: a line for one parameter, a heat map for two. */
export function sweepChart(r: SweepResultReply): ChartSpec {
  const [a, b] = r.axes;
  const label = (axis: { label: string; unit: string }) => `${axis.label} (${axis.unit})`;
  if (!b) {
    return {
      option: {
        tooltip: { trigger: 'axis' }, grid,
        xAxis: { type: 'value', name: label(a), nameLocation: 'middle', nameGap: 30, scale: true },
        yAxis: { type: 'value', name: 'Added melt (mm w.e.)' },
        series: [{ type: 'line', name: 'Added melt', data: a.values.map((v, i) => [roundTo(v, 4), roundTo(r.addedMeltMm[0][i], 1)]) }],
      },
      table: {
        columns: [{ name: 'a', label: label(a) }, { name: 'melt', label: 'Melt (mm w.e.)' }, { name: 'added', label: 'Added melt (mm w.e.)' }],
        rows: a.values.map((v, i) => ({ a: roundTo(v, 4), melt: roundTo(r.meltMm[0][i], 1), added: roundTo(r.addedMeltMm[0][i], 1) })),
      },
    };
  }
  const cells = a.values.flatMap((_, i) => b.values.map((__, j) => [i, j, roundTo(r.addedMeltMm[i][j], 1)]));
  const values = cells.map((c) => c[2]);
  return {
    option: {
      tooltip: { position: 'top' },
      grid: { ...grid, right: 90 },
      xAxis: { type: 'category', name: label(a), nameLocation: 'middle', nameGap: 30, data: a.values.map((v) => String(roundTo(v, 3))) },
      yAxis: { type: 'category', name: label(b), data: b.values.map((v) => String(roundTo(v, 3))) },
      visualMap: { min: Math.min(...values), max: Math.max(...values), calculable: true, orient: 'vertical', right: 0, top: 'center', text: ['mm w.e.', ''] },
      series: [{ type: 'heatmap', name: 'Added melt (mm w.e.)', data: cells }],
    },
    table: {
      columns: [{ name: 'a', label: label(a) }, { name: 'b', label: label(b) }, { name: 'melt', label: 'Melt (mm w.e.)' }, { name: 'added', label: 'Added melt (mm w.e.)' }],
      rows: a.values.flatMap((va, i) => b.values.map((vb, j) => ({ a: roundTo(va, 4), b: roundTo(vb, 4), melt: roundTo(r.meltMm[i][j], 1), added: roundTo(r.addedMeltMm[i][j], 1) }))),
    },
  };
}

/** Simulated against observed discharge, day by day. */
export function dischargeChart(e: DischargeEvaluationReply, monthly = false): ChartSpec {
  const s = monthly ? e.monthlySeries : e.series;
  return {
    option: {
      tooltip: { trigger: 'axis' }, legend, grid,
      xAxis: { type: 'category', data: s.dates },
      yAxis: { type: 'value', name: 'Discharge (m³/s)' },
      dataZoom: monthly ? [] : [{ type: 'inside' }],
      series: [
        { name: 'Observed', type: 'line', showSymbol: monthly, data: s.observed.map((v) => roundTo(v, 3)), lineStyle: { color: INK }, itemStyle: { color: INK } },
        { name: 'Simulated', type: 'line', showSymbol: monthly, data: s.simulated.map((v) => roundTo(v, 3)), lineStyle: { color: seriesColour(0) }, itemStyle: { color: seriesColour(0) } },
      ],
    },
    table: {
      columns: [{ name: 'date', label: monthly ? 'Month' : 'Date' }, { name: 'obs', label: 'Observed (m³/s)' }, { name: 'sim', label: 'Simulated (m³/s)' }],
      rows: s.dates.map((d, i) => ({ date: d, obs: roundTo(s.observed[i], 3), sim: roundTo(s.simulated[i], 3) })),
    },
  };
}

/** Daily melt of the band by the three models. */
export function referenceChart(r: ReferenceModels): ChartSpec {
  return {
    option: {
      tooltip: { trigger: 'axis' }, legend, grid,
      xAxis: { type: 'category', data: r.dates },
      yAxis: { type: 'value', name: 'Melt (mm w.e. per day)' },
      dataZoom: [{ type: 'inside' }],
      series: r.models.map((m) => ({ name: m.label, type: 'line', showSymbol: false, data: m.dailyMm.map((v) => roundTo(v, 2)) })),
    },
    table: {
      columns: [{ name: 'date', label: 'Date' }, ...r.models.map((m) => ({ name: m.key, label: `${m.label} (mm w.e.)` }))],
      rows: r.dates.map((d, i) => ({ date: d, ...Object.fromEntries(r.models.map((m) => [m.key, roundTo(m.dailyMm[i], 2)])) })),
    },
  };
}

/** Measured against simulated stake balances, with the 1:1 line. */
export function stakeChart(r: StakeSkillReply['comparison']): ChartSpec {
  const all = r.readings.flatMap((x) => [x.balanceMWe, x.simulatedMWe]);
  const lo = Math.floor(Math.min(...all, 0));
  const hi = Math.ceil(Math.max(...all, 0));
  return {
    option: {
      tooltip: { trigger: 'item' }, legend, grid,
      xAxis: { type: 'value', name: 'Measured (m w.e.)', nameLocation: 'middle', nameGap: 30, min: lo, max: hi, axisLine: { onZero: false } },
      yAxis: { type: 'value', name: 'Simulated (m w.e.)', min: lo, max: hi, axisLine: { onZero: false } },
      series: [
        { name: 'Stake readings', type: 'scatter', data: r.readings.map((x) => ({ value: [x.balanceMWe, roundTo(x.simulatedMWe, 2)], name: `${x.stake} ${x.from.slice(0, 4)}–${x.to.slice(0, 4)}` })) },
        { name: '1:1', type: 'line', showSymbol: false, data: [[lo, lo], [hi, hi]], lineStyle: { type: 'dashed', color: GUIDE_GREY }, itemStyle: { color: GUIDE_GREY } },
      ],
    },
    table: {
      columns: [
        { name: 'stake', label: 'Stake' }, { name: 'z', label: 'Elevation (m)' }, { name: 'from', label: 'From' }, { name: 'to', label: 'To' },
        { name: 'obs', label: 'Measured (m w.e.)' }, { name: 'sim', label: 'Simulated (m w.e.)' },
      ],
      rows: r.readings.map((x) => ({ stake: x.stake, z: x.elevationM, from: x.from, to: x.to, obs: x.balanceMWe, sim: roundTo(x.simulatedMWe, 3) })),
    },
  };
}
