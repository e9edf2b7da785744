import {
  type SymbolType,
  symbol,
  symbolCircle,
  symbolCross,
  symbolDiamond,
  symbolSquare,
  symbolStar,
  symbolTriangle,
  symbolWye,
} from 'd3';

/** One marker shape per event kind, so kinds stay apart without relying on colour. */
const SYMBOL_BY_KIND: Record<string, { type: SymbolType; label: string }> = {
  contact: { type: symbolCross, label: 'Contact' },
  protective_stop: { type: symbolSquare, label: 'Protective stop' },
  emergency_stop: { type: symbolTriangle, label: 'Emergency stop' },
  warning_field: { type: symbolDiamond, label: 'Warning field' },
  operator_note: { type: symbolCircle, label: 'Operator note' },
};
const OTHER = { type: symbolWye, label: 'Other event' };

export const EVENT_KINDS_WITH_SHAPES = Object.keys(SYMBOL_BY_KIND);

/** SVG path `d` (centred on 0,0) of the marker for an event kind; `area` in px^2. */
export function eventSymbolPath(kind: string, area = 64): string {
  return symbol((SYMBOL_BY_KIND[kind] ?? OTHER).type, area)() ?? '';
}

/** Readable name of an event kind; unknown kinds keep their recorded name. */
export function eventKindLabel(kind: string): string {
  return SYMBOL_BY_KIND[kind]?.label ?? kind.replaceAll('_', ' ');
}

/** Star for flags in lists, kept here so all marker shapes come from one place. */
export const flagSymbolPath = (area = 64) => symbol(symbolStar, area)() ?? '';
