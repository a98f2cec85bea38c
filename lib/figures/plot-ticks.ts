import type { ScaleContinuousNumeric } from "d3";
import { formatSignificant } from "@/lib/numbers/significant";

type Scale = ScaleContinuousNumeric<number, number>;

/** A tick's label: a plain number, or a power of ten written `10^{n}` for plotText. */
export interface AxisTick {
  value: number;
  /** null for an unlabelled (minor) tick. */
  label: string | null;
}

/** A leading hyphen-minus of a number becomes the minus sign U+2212 (typographic practice). */
export function withMinusSign(label: string): string {
  return label.replace(/^-(?=[\d.])/, "−");
}

const isLogScale = (scale: Scale) => "base" in scale;

/**
 * The ticks of an axis, labelled without SI prefixes (d3's log format writes 0.01 as "10m", read as
 * metres beside a unit of radians): on a log axis spanning two decades or more, decades as powers of
 * ten and the ticks between them unlabelled; otherwise the scale's own format (a custom one, such as
 * clock hours, included), with a true minus sign.
 */
export function axisTicks(scale: Scale, count: number): AxisTick[] {
  const values = scale.ticks(count);
  if (isLogScale(scale)) {
    const decadeOf = (value: number) => Math.round(Math.log10(value));
    const isDecade = (value: number) => Math.abs(Math.log10(value) - decadeOf(value)) < 1e-9;
    if (values.filter(isDecade).length >= 2) return values.map((value) => ({ value, label: isDecade(value) ? `10^{${withMinusSign(String(decadeOf(value)))}}` : null }));
    return values.map((value) => ({ value, label: formatSignificant(value, 6) }));
  }
  const format = scale.tickFormat(count);
  return values.map((value) => ({ value, label: withMinusSign(format(value)) }));
}
