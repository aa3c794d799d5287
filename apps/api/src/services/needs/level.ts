/** The level card: assigned against the rubric, and the latest surface score against the target. */
import { desc, eq } from 'drizzle-orm';
import { recommendLevel, type FieldNeeds, type PlayLevel, type SiteKind, type Sport, type Visibility } from '@swardwise/domain';
import { fieldChecks } from '../../db/schema/index.ts';
import type { Ctx } from '../context.ts';
import { input, type NeedsBasis } from './basis.ts';

/**
 * Level of play and visibility are not recorded per field yet: they are read from the site
 * and the sport (department assumption, shown as such in the inputs).
 */
function assumedUse(kind: SiteKind, sport: Sport): { play: PlayLevel; visibility: Visibility } {
  if (sport === 'lawn') return { play: 'informal', visibility: kind === 'park' ? 'medium' : 'low' };
  if (kind === 'school') return { play: 'varsity', visibility: 'medium' };
  if (kind === 'complex') return { play: 'league', visibility: 'medium' };
  return { play: 'recreation', visibility: 'low' };
}

export async function levelCard(ctx: Ctx, b: NeedsBasis, workCompliance: FieldNeeds['level']['workCompliance']) {
  const { field, level, std, site } = b;
  const use = assumedUse(site.kind, field.sport);
  const rec = recommendLevel({ play: use.play, visibility: use.visibility, weeklyUseHours: Math.min(168, field.weeklyUseHours), rootzone: field.rootzone, irrigation: field.irrigation });
  const [latest] = await ctx.db.select({ checkedOn: fieldChecks.checkedOn, score: fieldChecks.score }).from(fieldChecks).where(eq(fieldChecks.fieldId, field.id)).orderBy(desc(fieldChecks.checkedOn), desc(fieldChecks.id)).limit(1);
  return {
    assigned: level,
    recommended: rec.level,
    points: rec.points,
    reasons: rec.reasons,
    targetScore: std.targetScore,
    latestCheck: latest ? { checkedOn: latest.checkedOn, score: latest.score } : null,
    scoreMet: latest ? latest.score >= std.targetScore : null,
    workCompliance,
    inputs: [
      input('play', 'Level of play (assumed from the site and sport)', use.play),
      input('visibility', 'Visibility (assumed from the site)', use.visibility),
      input('use', 'Use per week', field.weeklyUseHours, 'h'),
      input('rootzone', 'Rootzone', field.rootzone),
      input('irrigation', 'Irrigation', field.irrigation),
      input('checkDays', 'Standards: days between field checks', std.fieldCheckDays, 'd'),
    ],
    how: 'The department rubric adds points for level of play, hours of use per week, visibility, rootzone and irrigation (8 or more: level 1; 5: level 2; 2: level 3; else 4; no irrigation holds a field at level 3 or lower). Compliance compares the latest field check\u2019s surface score with the level\u2019s target score, and the work orders done with those planned (the tally Records shows).',
    cautions: [] as string[],
  };
}
