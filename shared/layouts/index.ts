import { CalculationInputError } from '../errors';
import { BS2051_LAYOUTS } from './bs2051';
import { IAMF_916_LAYOUT } from './iamf-916';
import type { Layout } from './types';

export type { AngleRangeDeg, Layout, LayoutChannel, LayoutLayer, LayoutRules } from './types';

/** Every layout Isochron knows: BS.2051-3 systems A–J, then 9.1.6. */
export const LAYOUTS: readonly Layout[] = [...BS2051_LAYOUTS, IAMF_916_LAYOUT];

function normalise(key: string): string {
  return key.trim().toLowerCase();
}

const BY_KEY: ReadonlyMap<string, Layout> = new Map(
  LAYOUTS.flatMap((layout) => {
    const keys = [layout.id, layout.name, ...layout.aliases];
    if (layout.system) keys.push(layout.system, `system-${layout.system}`);
    return keys.map((key): [string, Layout] => [normalise(key), layout]);
  }),
);

/**
 * Finds a layout by its id (`bs2051-j`), its BS.2051 name (`4+7+0`), its system letter (`J`) or a trade
 * alias (`7.1.4`), case-insensitively. Returns undefined when nothing matches.
 */
export function findLayout(key: string): Layout | undefined {
  return BY_KEY.get(normalise(key));
}

/**
 * Like findLayout, but throws a CalculationInputError naming `field` and listing the accepted ids when
 * nothing matches.
 */
export function requireLayout(key: string, field = '/layout'): Layout {
  const layout = findLayout(key);
  if (!layout) {
    throw new CalculationInputError(
      `layout "${key}" is unknown; use one of ${LAYOUTS.map((l) => l.id).join(', ')} or an alias such as 7.1.4`,
      field,
    );
  }
  return layout;
}
