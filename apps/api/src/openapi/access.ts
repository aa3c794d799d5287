/**
 * Who may call a route, in words, worked out from the shared abilities (never written by
 * hand), so the document changes when `defineAbilityFor` does.
 */
import { ROLES, ROLE_LABELS, asSubject, defineAbilityFor, type Action, type Actor, type Role, type ScopedRow, type SubjectName } from '@swardwise/domain';

export type Access =
  /** Anyone, signed in or not. */
  | { kind: 'public'; note?: string }
  /** Any signed-in user, whatever the role. */
  | { kind: 'signed-in'; note?: string }
  /** Roles the abilities allow `action` on `subject`. */
  | {
      kind: 'ability';
      action: Action;
      subject: SubjectName;
      /** The row the service checks the ability against, when it checks one before reading anything. */
      probe?: (actor: Actor) => ScopedRow;
      /** Roles the service refuses beyond the abilities. */
      except?: readonly Role[];
      note?: string;
    };

export const publicAccess = (note?: string): Access => ({ kind: 'public', ...(note ? { note } : {}) });
export const signedIn = (note?: string): Access => ({ kind: 'signed-in', ...(note ? { note } : {}) });
export const allowed = (action: Action, subject: SubjectName, more: { probe?: (actor: Actor) => ScopedRow; except?: readonly Role[]; note?: string } = {}): Access => ({
  kind: 'ability',
  action,
  subject,
  ...more,
});

export interface RoleAccess {
  role: Role;
  /** Limits on the rows, e.g. `own district`; empty when the role may act on every row. */
  scope: string[];
}

// Values no real row carries, so a condition of a rule can be read back as words.
const PROBE = { user: 900_001, district: 900_002, crew: 900_003, site: 900_004 } as const;
const WORDS = new Map<number, string>([
  [PROBE.user, 'own account'],
  [PROBE.district, 'own district'],
  [PROBE.crew, 'own crew'],
  [PROBE.site, 'linked sites'],
]);

function probeActor(role: Role): Actor {
  return { id: PROBE.user, role, districtId: PROBE.district, crewId: PROBE.crew, siteIds: [PROBE.site] };
}

/** `{ districtId: 900002, crewIds: 900003 }` → `['own district', 'own crew']`. */
function conditionWords(conditions: Record<string, unknown>): string[] {
  const words: string[] = [];
  for (const [key, value] of Object.entries(conditions)) {
    const values = typeof value === 'number' ? [value] : Array.isArray((value as { $in?: unknown })?.$in) ? ((value as { $in: unknown[] }).$in as number[]) : [];
    const said = values.map((v) => WORDS.get(v));
    if (said.length === 0 || said.some((w) => w === undefined)) {
      // A new kind of condition in the abilities: say it here rather than document it wrongly.
      throw new Error(`openapi/access: no words for the ability condition ${key}: ${JSON.stringify(value)}`);
    }
    words.push(...(said as string[]));
  }
  return words;
}

/** The roles `access` lets in, each with the rows it is limited to. */
export function rolesOf(access: Access): RoleAccess[] {
  if (access.kind !== 'ability') return [];
  const out: RoleAccess[] = [];
  for (const role of ROLES) {
    if (access.except?.includes(role)) continue;
    const actor = probeActor(role);
    const ability = defineAbilityFor(actor);
    const row = access.probe ? asSubject(access.subject, access.probe(actor)) : undefined;
    if (!(row ? ability.can(access.action, row) : ability.can(access.action, access.subject))) continue;
    const rules = ability.rulesFor(access.action, access.subject).filter((r) => !r.inverted && (!row || r.matchesConditions(row)));
    const unlimited = rules.some((r) => !r.conditions);
    const scope = unlimited ? [] : [...new Set(rules.flatMap((r) => conditionWords(r.conditions as Record<string, unknown>)))];
    out.push({ role, scope });
  }
  return out;
}

/** One sentence for the operation's description, e.g. "Who: Administrator; District foreman (own district)." */
export function accessSentence(access: Access): string {
  const note = access.note ? ` ${access.note}` : '';
  if (access.kind === 'public') return `Who: anyone; no sign-in needed.${note}`;
  if (access.kind === 'signed-in') return `Who: any signed-in user.${note}`;
  const roles = rolesOf(access);
  if (roles.length === 0) throw new Error(`openapi/access: no role may ${access.action} ${access.subject}`);
  const list = roles.map(({ role, scope }) => (scope.length ? `${ROLE_LABELS[role]} (${scope.join(', ')})` : ROLE_LABELS[role]));
  return `Who: ${list.join('; ')}.${note}`;
}
