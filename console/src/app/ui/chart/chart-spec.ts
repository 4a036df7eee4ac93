/** A chart described without any charting library types, so pages and helpers stay plain data. */
export interface ChartSpec {
  kind: 'line' | 'bar';
  /** `log` draws frequency axes; `category` uses `labels`. */
  xScale: 'category' | 'log';
  labels?: string[];
  xTitle?: string;
  yTitle?: string;
  /** Title of the right-hand axis for series with `axis: 'right'` (phase in degrees, for instance). */
  rightTitle?: string;
  yMin?: number;
  yMax?: number;
  /** Distance between labelled y ticks, so the bounds land on labels. */
  yStep?: number;
  stacked?: boolean;
  /** Bars run left to right with the categories down the side (long labels such as routes). */
  horizontal?: boolean;
  series: ChartSeries[];
  /** Sentence read by screen readers in place of the canvas. */
  summary: string;
}

export interface ChartSeries {
  label: string;
  /** Numbers for category charts; points for numeric x axes. */
  values?: Array<number | null>;
  /** Points for numeric x axes; a null y leaves a gap in the line. */
  points?: Array<{ x: number; y: number | null }>;
  /** Index into the console's series colours (1-6); 0 is the muted colour for outlines. */
  colour: number;
  axis?: 'left' | 'right';
  dashed?: boolean;
  fill?: boolean;
  kind?: 'line' | 'bar' | 'scatter';
  /** For scatter series: join the points with a line (an outline). */
  showLine?: boolean;
  pointRadius?: number;
  pointStyle?: 'circle' | 'rect' | 'triangle' | 'crossRot' | 'rectRot';
}
