import { createMongoAbility } from '@casl/ability';
import type { Action, AppAbility, Subjects } from '@swardwise/domain';

/**
 * The one ability instance of the portal. It starts empty and is filled with the shared
 * rules at sign-in, so components that hold it (through `useAbility`) update in place.
 */
export const ability: AppAbility = createMongoAbility<[Action, Subjects]>();
