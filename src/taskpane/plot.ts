import { axisBottom, axisLeft } from 'd3-axis';
import { scaleLinear } from 'd3-scale';
import { select } from 'd3-selection';
import { line } from 'd3-shape';

// SVG charts drawn with d3 (scales, shapes, axes); text goes in through .text(), never as markup.

export const SERIES_COLOURS = ['#0e7478', '#d9822b', '#5b4b8a', '#7a9e1f', '#b8336a', '#2f6fb0', '#8c6d31'];

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

const WIDTH = 300, HEIGHT = 200;
const MARGIN = { top: 22, right: 10, bottom: 34, left: 40 };

export function drawChart(container: HTMLElement, series: Series[], options: ChartOptions): void {
  select(container).selectAll('*').remove();
  const ys = series.flatMap((s) => s.points.map((p) => p[1]));
  const yDomain = options.yDomain ?? [Math.min(...ys), Math.max(...ys)];
  const x = scaleLinear().domain(options.xDomain).range([MARGIN.left, WIDTH - MARGIN.right]);
  const y = scaleLinear().domain(yDomain).nice().range([HEIGHT - MARGIN.bottom, MARGIN.top]);
  const svg = select(container).append('svg').attr('viewBox', `0 0 ${WIDTH} ${HEIGHT}`).attr('role', 'img').attr('aria-label', options.title);
  svg.append('text').attr('x', MARGIN.left).attr('y', 14).attr('class', 'chart-title').text(options.title);
  svg.append('g').attr('transform', `translate(0,${HEIGHT - MARGIN.bottom})`).call(axisBottom(x).ticks(7));
  svg.append('g').attr('transform', `translate(${MARGIN.left},0)`).call(axisLeft(y).ticks(5));
  svg.append('text').attr('x', WIDTH / 2).attr('y', HEIGHT - 4).attr('text-anchor', 'middle').attr('class', 'axis-label').text(options.xLabel);
  svg.append('text').attr('transform', `translate(11,${HEIGHT / 2}) rotate(-90)`).attr('text-anchor', 'middle').attr('class', 'axis-label').text(options.yLabel);
  for (const [mx, label, cls] of options.marks ?? []) {
    if (mx < options.xDomain[0] || mx > options.xDomain[1]) continue;
    svg.append('line').attr('class', cls).attr('x1', x(mx)).attr('x2', x(mx)).attr('y1', MARGIN.top).attr('y2', HEIGHT - MARGIN.bottom);
    svg.append('text').attr('class', `${cls}-label`).attr('x', x(mx) + 2).attr('y', MARGIN.top + 8).text(label);
  }
  const path = line<[number, number]>().x((p) => x(p[0])).y((p) => y(p[1]));
  series.forEach((s, i) => {
    svg.append('path').attr('class', options.seriesClass).attr('data-label', s.label).attr('fill', 'none')
      .attr('stroke', SERIES_COLOURS[i % SERIES_COLOURS.length]).attr('stroke-width', 2).attr('d', path(s.points) ?? '');
  });
  const legend = select(container).append('ul').attr('class', 'legend');
  series.forEach((s, i) => {
    const item = legend.append('li');
    item.append('span').attr('class', 'swatch').style('background', SERIES_COLOURS[i % SERIES_COLOURS.length]);
    item.append('span').text(s.label);
  });
}
