import type { AnyChangeRule } from '../src/compare/types.js';
import auditFindingsChanged from './audit-findings-changed.js';
import columnsChanged from './columns-changed.js';
import distributionShifted from './distribution-shifted.js';
import groupSizeChanged from './group-size-changed.js';
import groupsAppeared from './groups-appeared.js';
import groupsVanished from './groups-vanished.js';
import level2ValueChanged from './level2-value-changed.js';
import missingRateChanged from './missing-rate-changed.js';
import outcomeIccChanged from './outcome-icc-changed.js';
import unitsLeftOrJoined from './units-left-or-joined.js';
import unitsMoved from './units-moved.js';

/** The change checks of `compare` and `audit --baseline`, alphabetical by id (test/compare/catalogue.test.ts). */
export const changeCatalogue: readonly AnyChangeRule[] = [
  auditFindingsChanged,
  columnsChanged,
  distributionShifted,
  groupSizeChanged,
  groupsAppeared,
  groupsVanished,
  level2ValueChanged,
  missingRateChanged,
  outcomeIccChanged,
  unitsLeftOrJoined,
  unitsMoved,
];
