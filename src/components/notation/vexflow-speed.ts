/**
 * Three of VexFlow's hot paths, made cheap without changing what they return. Profiling a key
 * cycle (12 staves of 240 notes) showed most of the drawing time in them:
 * - SVGContext.save/restore deep-copy the drawing state with structuredClone on every glyph;
 *   the state and attributes are flat records of strings and numbers, so a shallow copy is the
 *   same copy.
 * - Metrics.getFontInfo/getStyle deep-copy a cached flat record on every element (same again),
 *   and Metrics.get walks the defaults tree by a split key every time; its answers are kept until
 *   VexFlow clears its metrics (as it does when the fonts change).
 * - Element.measureText sets the canvas font and measures the same few glyphs (noteheads,
 *   accidentals, digits) thousands of times; the result depends only on the font and the text,
 *   so it is kept per font and text (and dropped when a web font finishes loading).
 * Applied once, when the staff renderer's chunk loads.
 */
import { Element, Font, Metrics, SVGContext } from 'vexflow/core';

type Flat = Record<string, unknown>;
interface ContextState {
  state: Flat;
  attributes: Flat;
  stateStack: { state: Flat; attributes: Flat }[];
}
interface MeasuredElement {
  text: string;
  fontInfo: Parameters<typeof Font.validate>[0];
  _textMetrics: TextMetrics;
  _height: number;
  _width: number;
  metricsValid: boolean;
}

let applied = false;

export function speedUpVexFlow(): void {
  if (applied) return;
  applied = true;

  const context = SVGContext.prototype as unknown as ContextState & { save(): unknown; restore(): unknown };
  context.save = function save(this: ContextState) {
    this.stateStack.push({ state: { ...this.state }, attributes: { ...this.attributes } });
    return this;
  };
  context.restore = function restore(this: ContextState) {
    // The saved records were copies made by save() and nothing else holds them.
    const saved = this.stateStack.pop();
    if (saved) {
      this.state = saved.state;
      this.attributes = saved.attributes;
    }
    return this;
  };

  const fonts = new Map<string, Flat>();
  const styles = new Map<string, Flat>();
  const found = new Map<string, unknown>();
  const metrics = Metrics as unknown as {
    getFontInfo(key: string): Flat;
    getStyle(key: string): Flat;
    get(key: string, defaultValue?: unknown): unknown;
    clear(key?: string): void;
  };
  const fontInfoOf = metrics.getFontInfo.bind(Metrics);
  const styleOf = metrics.getStyle.bind(Metrics);
  const lookUp = metrics.get.bind(Metrics);
  const clear = metrics.clear.bind(Metrics);
  metrics.clear = (key?: string) => {
    fonts.clear();
    styles.clear();
    found.clear();
    clear(key);
  };
  metrics.get = (key: string, defaultValue?: unknown) => {
    const k = defaultValue === undefined ? key : `${key}\u0000${String(defaultValue)}`;
    if (found.has(k)) return found.get(k);
    const value = lookUp(key, defaultValue);
    found.set(k, value);
    return value;
  };
  metrics.getFontInfo = (key: string) => {
    let font = fonts.get(key);
    if (!font) {
      font = fontInfoOf(key);
      fonts.set(key, font);
    }
    return { ...font };
  };
  metrics.getStyle = (key: string) => {
    let style = styles.get(key);
    if (!style) {
      style = styleOf(key);
      styles.set(key, style);
    }
    return { ...style };
  };

  const measured = new Map<string, TextMetrics>();
  if (typeof document !== 'undefined' && document.fonts) {
    document.fonts.addEventListener('loadingdone', () => measured.clear());
  }
  const element = Element.prototype as unknown as { measureText(): TextMetrics };
  const measureOnce = element.measureText;
  element.measureText = function measureText(this: MeasuredElement) {
    const key = `${Font.toCSSString(Font.validate(this.fontInfo))}\u0000${this.text}`;
    let m = measured.get(key);
    if (!m) {
      m = measureOnce.call(this);
      measured.set(key, m);
    }
    this._textMetrics = m;
    this._height = m.actualBoundingBoxAscent + m.actualBoundingBoxDescent;
    this._width = m.width;
    this.metricsValid = true;
    return m;
  };
}
