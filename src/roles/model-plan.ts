import { InputError, quoteName } from '../errors.js';
import type { Roles } from './types.js';

type Locate = (path: (string | number)[]) => string;
type Path = (string | number)[];

/**
 * The model the analyst plans (slopes, time, weights, the predictor to detect), normalised: a
 * slope or the time variable is a level-1 variable and the predictor a level-2 one, so they are
 * added to those lists when the map leaves them out (the level-1 and level-2 rules then check
 * them too); none may play another part. Weights play no other part at all.
 */
export function modelPlan(map: Record<string, unknown>, roles: Roles, locate: Locate): Partial<Roles> {
  const refuse = (column: string, path: Path, role: string, as: string): never => {
    throw new InputError(`${locate(path)}: column ${quoteName(column)} is both ${role} and ${as}`);
  };
  const place = (column: string, path: Path, level: 'level1' | 'level2', as: string) => {
    const role = partOf(column, roles);
    if (role && role !== level) refuse(column, path, role, as);
    if (!role) roles[level].push(column);
  };
  const out: Partial<Roles> = {};
  const slopes = map.slopes === undefined ? [] : Array.isArray(map.slopes) ? map.slopes.map(String) : [String(map.slopes)];
  for (const [i, c] of slopes.entries()) place(c, Array.isArray(map.slopes) ? ['slopes', i] : ['slopes'], 'level1', 'slopes');
  if (slopes.length) out.slopes = slopes;
  if (map.time !== undefined) {
    out.time = String(map.time);
    place(out.time, ['time'], 'level1', 'time');
  }
  const detect = map.detect as { predictor: string; effect_size?: number } | undefined;
  if (detect) {
    place(detect.predictor, ['detect', 'predictor'], 'level2', 'the predictor to detect');
    out.detect = { predictor: detect.predictor, ...(detect.effect_size !== undefined && { effectSize: detect.effect_size }) };
  }
  const weights = map.weights as Roles['weights'];
  if (weights?.level1 !== undefined || weights?.level2 !== undefined) {
    if (weights.level1 === weights.level2) refuse(String(weights.level1), ['weights', 'level2'], 'weights.level1', 'weights.level2');
    for (const level of ['level1', 'level2'] as const) {
      const column = weights[level];
      const role = column === undefined ? undefined : partOf(column, roles);
      if (column !== undefined && role) refuse(column, ['weights', level], role, `weights.${level}`);
    }
    out.weights = { ...weights };
  }
  return out;
}

/** The part a column already plays in the map's identifiers and variable lists. */
function partOf(column: string, roles: Roles): string | undefined {
  if (column === roles.group) return 'group';
  if (column === roles.unit) return 'unit';
  if (column === roles.parent) return 'parent';
  if (roles.outcomes.includes(column)) return 'an outcome';
  if (roles.level1.includes(column)) return 'level1';
  if (roles.level2.includes(column)) return 'level2';
  return undefined;
}
