import type { EChartsCoreOption } from 'echarts/core';
import type { DischargeEvaluationReply, ReferenceModels, StakeSkillReply, SurfaceResponse, SweepResultReply } from '@shared/schemas/lab';
import type { ChartTable } from 'src/components/BaseChart.vue';

/** Chart option and the same numbers as a table, for BaseChart. */
export interface LabChart {
  option: EChartsCoreOption;
  table: ChartTable;
}

const round = (v: number, digits = 1) => Math.round(v * 10 ** digits) / 10 ** digits;
const cm = (m: number) => `${round(m * 100, 1)} cm`;
const grid = { left: 64, right: 24, top: 48, bottom: 56 };
const legend = { top: 0, type: 'scroll' as const };

/** Østrem curve: melt under debris against thickness (log axis), with peak, critical thickness and clean ice marked. */
export function ostremChart(r: SurfaceResponse): LabChart {
  const { present, warmer, darker } = r.ostrem;
  const curves = [present, ...warmer, darker];
  const marks = {
    markPoint: {
      symbol: 'circle', symbolSize: 10,
      data: [{ name: 'Peak', coord: [present.peak.thicknessM, present.peak.meltMm], value: `Peak ${cm(present.peak.thicknessM)}, ${round(present.peak.meltMm, 0)} mm` }],
      label: { position: 'right', offset: [2, -14], fontWeight: 'bold' },
    },
    markLine: {
      symbol: 'none',
      data: [
        { yAxis: present.cleanIceMeltMm, label: { formatter: `Clean ice ${round(present.cleanIceMeltMm, 0)} mm`, position: 'insideEndTop' }, lineStyle: { type: 'dashed' } },
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
        name: c.label, type: 'line', showSymbol: false, data: c.points.map((p) => [p.thicknessM, round(p.meltMm)]),
        lineStyle: i === 0 ? { width: 3 } : { width: 1.5, type: i === curves.length - 1 ? 'dashed' : 'solid' },
        ...(i === 0 ? marks : {}),
      })),
    },
    table: {
      columns: [{ name: 'h', label: 'Debris thickness (m)' }, ...curves.map((c, i) => ({ name: `c${i}`, label: `${c.label} (mm w.e.)` }))],
      rows: [
        { h: 0, ...Object.fromEntries(curves.map((c, i) => [`c${i}`, round(c.cleanIceMeltMm)])) },
        ...present.points.map((p, k) => ({ h: round(p.thicknessM, 4), ...Object.fromEntries(curves.map((c, i) => [`c${i}`, round(c.points[k].meltMm)])) })),
      ],
    },
  };
}

/** Melt against black carbon (log axis; the clean value, 0 ng/g, is in the table). */
export function impurityChart(r: SurfaceResponse): LabChart {
  return {
    option: {
      tooltip: { trigger: 'axis' },
      legend,
      grid,
      xAxis: { type: 'log', name: 'Black carbon (ng/g)', nameLocation: 'middle', nameGap: 30, min: 1, max: 5000 },
      yAxis: { type: 'value', name: 'Melt (mm w.e.)' },
      series: r.impurity.map((c) => ({ name: c.label, type: 'line', showSymbol: true, symbolSize: 4, data: c.points.filter((p) => p.blackCarbonNgG > 0).map((p) => [round(p.blackCarbonNgG, 2), round(p.meltMm)]) })),
    },
    table: {
      columns: [{ name: 'bc', label: 'Black carbon (ng/g)' }, ...r.impurity.map((c) => ({ name: c.surface, label: `${c.label} (mm w.e.)` }))],
      rows: r.impurity[0].points.map((p, k) => ({ bc: round(p.blackCarbonNgG, 2), ...Object.fromEntries(r.impurity.map((c) => [c.surface, round(c.points[k].meltMm)])) })),
    },
  };
}

/** Melt change per °C, side by side: snow, clean ice and debris of several thicknesses (the band's own marked). */
export function warmingChart(r: SurfaceResponse): LabChart {
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
      series: [{ type: 'bar', data: bars.map((b, i) => ({ value: round(b.value), itemStyle: { color: i < 2 ? (i === 0 ? '#90a4ae' : '#1e88e5') : i === 2 && warming.bandDebris ? '#6d4c41' : '#a1887f' } })) }],
    },
    table: {
      columns: [{ name: 'surface', label: 'Surface' }, { name: 'perC', label: 'Melt change (mm w.e. per °C)' }],
      rows: [
        { surface: 'Snow', perC: round(warming.snowPerC) },
        { surface: 'Clean ice', perC: round(warming.cleanIcePerC) },
        ...warming.debris.map((d) => ({ surface: `Debris ${round(d.thicknessM, 4)} m`, perC: round(d.perC) })),
      ],
    },
  };
}

/** Added melt of a sweep: a line for one parameter, a heat map for two. */
export function sweepChart(r: SweepResultReply): LabChart {
  const [a, b] = r.axes;
  const label = (axis: { label: string; unit: string }) => `${axis.label} (${axis.unit})`;
  if (!b) {
    return {
      option: {
        tooltip: { trigger: 'axis' }, grid,
        xAxis: { type: 'value', name: label(a), nameLocation: 'middle', nameGap: 30, scale: true },
        yAxis: { type: 'value', name: 'Added melt (mm w.e.)' },
        series: [{ type: 'line', name: 'Added melt', data: a.values.map((v, i) => [round(v, 4), round(r.addedMeltMm[0][i])]) }],
      },
      table: {
        columns: [{ name: 'a', label: label(a) }, { name: 'melt', label: 'Melt (mm w.e.)' }, { name: 'added', label: 'Added melt (mm w.e.)' }],
        rows: a.values.map((v, i) => ({ a: round(v, 4), melt: round(r.meltMm[0][i]), added: round(r.addedMeltMm[0][i]) })),
      },
    };
  }
  const cells = a.values.flatMap((_, i) => b.values.map((__, j) => [i, j, round(r.addedMeltMm[i][j])]));
  const values = cells.map((c) => c[2]);
  return {
    option: {
      tooltip: { position: 'top' },
      grid: { ...grid, right: 90 },
      xAxis: { type: 'category', name: label(a), nameLocation: 'middle', nameGap: 30, data: a.values.map((v) => String(round(v, 3))) },
      yAxis: { type: 'category', name: label(b), data: b.values.map((v) => String(round(v, 3))) },
      visualMap: { min: Math.min(...values), max: Math.max(...values), calculable: true, orient: 'vertical', right: 0, top: 'center', text: ['mm w.e.', ''] },
      series: [{ type: 'heatmap', name: 'Added melt (mm w.e.)', data: cells }],
    },
    table: {
      columns: [{ name: 'a', label: label(a) }, { name: 'b', label: label(b) }, { name: 'melt', label: 'Melt (mm w.e.)' }, { name: 'added', label: 'Added melt (mm w.e.)' }],
      rows: a.values.flatMap((va, i) => b.values.map((vb, j) => ({ a: round(va, 4), b: round(vb, 4), melt: round(r.meltMm[i][j]), added: round(r.addedMeltMm[i][j]) }))),
    },
  };
}

/** Simulated against observed discharge, day by day. */
export function dischargeChart(e: DischargeEvaluationReply, monthly = false): LabChart {
  const s = monthly ? e.monthlySeries : e.series;
  return {
    option: {
      tooltip: { trigger: 'axis' }, legend, grid,
      xAxis: { type: 'category', data: s.dates },
      yAxis: { type: 'value', name: 'Discharge (m³/s)' },
      dataZoom: monthly ? [] : [{ type: 'inside' }],
      series: [
        { name: 'Observed', type: 'line', showSymbol: monthly, data: s.observed.map((v) => round(v, 3)), lineStyle: { color: '#263238' }, itemStyle: { color: '#263238' } },
        { name: 'Simulated', type: 'line', showSymbol: monthly, data: s.simulated.map((v) => round(v, 3)), lineStyle: { color: '#1e88e5' }, itemStyle: { color: '#1e88e5' } },
      ],
    },
    table: {
      columns: [{ name: 'date', label: monthly ? 'Month' : 'Date' }, { name: 'obs', label: 'Observed (m³/s)' }, { name: 'sim', label: 'Simulated (m³/s)' }],
      rows: s.dates.map((d, i) => ({ date: d, obs: round(s.observed[i], 3), sim: round(s.simulated[i], 3) })),
    },
  };
}

/** Daily melt of the band by the three models. */
export function referenceChart(r: ReferenceModels): LabChart {
  return {
    option: {
      tooltip: { trigger: 'axis' }, legend, grid,
      xAxis: { type: 'category', data: r.dates },
      yAxis: { type: 'value', name: 'Melt (mm w.e. per day)' },
      dataZoom: [{ type: 'inside' }],
      series: r.models.map((m) => ({ name: m.label, type: 'line', showSymbol: false, data: m.dailyMm.map((v) => round(v, 2)) })),
    },
    table: {
      columns: [{ name: 'date', label: 'Date' }, ...r.models.map((m) => ({ name: m.key, label: `${m.label} (mm w.e.)` }))],
      rows: r.dates.map((d, i) => ({ date: d, ...Object.fromEntries(r.models.map((m) => [m.key, round(m.dailyMm[i], 2)])) })),
    },
  };
}

/** Measured against simulated stake balances, with the 1:1 line. */
export function stakeChart(r: StakeSkillReply['comparison']): LabChart {
  const all = r.readings.flatMap((x) => [x.balanceMWe, x.simulatedMWe]);
  const lo = Math.floor(Math.min(...all, 0));
  const hi = Math.ceil(Math.max(...all, 0));
  return {
    option: {
      tooltip: { trigger: 'item' }, legend, grid,
      xAxis: { type: 'value', name: 'Measured (m w.e.)', nameLocation: 'middle', nameGap: 30, min: lo, max: hi, axisLine: { onZero: false } },
      yAxis: { type: 'value', name: 'Simulated (m w.e.)', min: lo, max: hi, axisLine: { onZero: false } },
      series: [
        { name: 'Stake readings', type: 'scatter', data: r.readings.map((x) => ({ value: [x.balanceMWe, round(x.simulatedMWe, 2)], name: `${x.stake} ${x.from.slice(0, 4)}–${x.to.slice(0, 4)}` })) },
        { name: '1:1', type: 'line', showSymbol: false, data: [[lo, lo], [hi, hi]], lineStyle: { type: 'dashed', color: '#9e9e9e' }, itemStyle: { color: '#9e9e9e' } },
      ],
    },
    table: {
      columns: [
        { name: 'stake', label: 'Stake' }, { name: 'z', label: 'Elevation (m)' }, { name: 'from', label: 'From' }, { name: 'to', label: 'To' },
        { name: 'obs', label: 'Measured (m w.e.)' }, { name: 'sim', label: 'Simulated (m w.e.)' },
      ],
      rows: r.readings.map((x) => ({ stake: x.stake, z: x.elevationM, from: x.from, to: x.to, obs: x.balanceMWe, sim: round(x.simulatedMWe, 3) })),
    },
  };
}
