import { parentedMoments } from '../profile/parent-blocks.js';
import type { Profile } from '../profile/types.js';
import { threeLevelModel } from '../stats/three-level-model.js';
import type { ThreeLevelStats } from '../stats/types.js';

/**
 * The three-level null model of an outcome (groups within parents), for the report and the
 * three-level-shares rule: undefined when the levels cannot be told apart (see threeLevelModel).
 *
 * @param profile the profile
 * @param parent the parent column of the role map
 * @param outcome a numeric-profiled outcome
 */
export function threeLevelOf(profile: Profile, parent: string, outcome: string): ThreeLevelStats | undefined {
  const { blocks, excluded } = parentedMoments(profile, parent, outcome);
  const model = threeLevelModel(blocks);
  return model ? { ...model, excludedGroups: excluded } : undefined;
}
