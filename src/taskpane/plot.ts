import { axisBottom, axisLeft } from 'd3-axis';
import { scaleLinear } from 'd3-scale';
import { select } from 'd3-selection';
import { line } from 'd3-shape';
import { FONT_PX, LINE_PX, placeMarkLabels } from './chartLabels';

// SVG charts drawn with d3 (scales, shapes, axes); text goes in through .text(), never as markup.

export const SERIES_COLOURS = ['#0e7478', '#d9822b', '#5b4b8a', '#7a9e1f', '#b8336a', '#2f6fb0', '#8c6d31'];

/** A series' colour: the theme's (CSS --series-N, lighter in dark), the light one where CSS gives none. */
function seriesColour(i: number): string {
  const k = i % SERIES_COLOURS.length;
  return `var(--series-${k}, ${SERIES_COLOURS[k]})`;
}

export interface Series { label: string; points: [number, number][] }

export interface ChartOptions {
  title: string;
  xLabel: string;
  yLabel: string;
  xDomain: [number, number];
  yDomain?: [number, number];
  /** vertical marks: [x, label, css class] */
  marks?: [number, string, string][];
  seriesClass: string;
}

const HEIGHT = 220;

export function drawChart(container: HTMLElement, series: Series[], options: ChartOptions): void {
  select(container).selectAll('*').remove();
  // drawn at the container's own width, so 12 px text is 12 px on screen at 320 px and at 450 px
  const WIDTH = Math.max(240, Math.round(container.clientWidth || 300));
  const marksIn = (options.marks ?? []).filter(([mx]) => mx >= options.xDomain[0] && mx <= options.xDomain[1]);
  const MARGIN = { top: 24, right: 12, bottom: 40, left: 48 };
  const xProvisional = scaleLinear().domain(options.xDomain).range([MARGIN.left, WIDTH - MARGIN.right]);
  const placed = placeMarkLabels(marksIn.map(([mx, text, cls]) => ({ x: xProvisional(mx), text, cls })), WIDTH - MARGIN.right);
  const labelLines = placed.reduce((n, p) => Math.max(n, p.line + 1), 0);
  MARGIN.top = 24 + labelLines * LINE_PX;
  const ys = series.flatMap((s) => s.points.map((p) => p[1]));
  const yDomain = options.yDomain ?? [Math.min(...ys), Math.max(...ys)];
  const x = scaleLinear().domain(options.xDomain).range([MARGIN.left, WIDTH - MARGIN.right]);
  const y = scaleLinear().domain(yDomain).nice().range([HEIGHT - MARGIN.bottom, MARGIN.top]);
  const svg = select(container).append('svg').attr('viewBox', `0 0 ${WIDTH} ${HEIGHT}`).attr('role', 'img').attr('aria-label', options.title);
  svg.append('text').attr('x', 0).attr('y', FONT_PX + 2).attr('class', 'chart-title').text(options.title);
  svg.append('g').attr('transform', `translate(0,${HEIGHT - MARGIN.bottom})`).call(axisBottom(x).ticks(WIDTH < 360 ? 7 : 14));
  svg.append('g').attr('transform', `translate(${MARGIN.left},0)`).call(axisLeft(y).ticks(5));
  svg.append('text').attr('x', (MARGIN.left + WIDTH - MARGIN.right) / 2).attr('y', HEIGHT - 6).attr('text-anchor', 'middle').attr('class', 'axis-label').text(options.xLabel);
  svg.append('text').attr('transform', `translate(${FONT_PX},${(MARGIN.top + HEIGHT - MARGIN.bottom) / 2}) rotate(-90)`).attr('text-anchor', 'middle').attr('class', 'axis-label').text(options.yLabel);
  for (const p of placed) {
    const top = 24 + p.line * LINE_PX;
    svg.append('line').attr('class', p.cls).attr('x1', p.x).attr('x2', p.x).attr('y1', top + 2).attr('y2', HEIGHT - MARGIN.bottom);
    svg.append('text').attr('class', `${p.cls}-label`).attr('x', p.anchor === 'start' ? p.x + 3 : p.x - 3).attr('y', top + FONT_PX - 1)
      .attr('text-anchor', p.anchor).text(p.text);
  }
  const path = line<[number, number]>().x((p) => x(p[0])).y((p) => y(p[1]));
  series.forEach((s, i) => {
    svg.append('path').attr('class', options.seriesClass).attr('data-label', s.label).attr('fill', 'none')
      .style('stroke', seriesColour(i)).attr('stroke-width', 2).attr('d', path(s.points) ?? '');
  });
  const legend = select(container).append('ul').attr('class', 'legend');
  series.forEach((s, i) => {
    const item = legend.append('li');
    item.append('span').attr('class', 'swatch').style('background', seriesColour(i));
    item.append('span').text(s.label);
  });
}
