import type { FormItemRule } from 'element-plus';
import type { z } from 'zod';

type Trigger = 'blur' | 'change';

export interface ZodRulesOptions<T> {
  /**
   * The whole form model. When given, checks that span several fields (a schema's
   * `superRefine`, e.g. "a foreman needs a district") are reported on the field they name.
   */
  model?: () => T;
  trigger?: Trigger | Trigger[];
}

/**
 * Turns a zod object schema into Element Plus form rules, one validator per field, so a
 * form shows the very messages the API would send back for the same input.
 */
export function zodRules<S extends z.ZodObject, T = z.input<S>>(
  schema: S,
  options: ZodRulesOptions<T> = {},
): Partial<Record<keyof S['shape'] & string, FormItemRule[]>> {
  const rules: Partial<Record<string, FormItemRule[]>> = {};
  const trigger = options.trigger ?? 'blur';

  for (const [key, fieldSchema] of Object.entries(schema.shape) as [string, z.ZodType][]) {
    rules[key] = [
      {
        // Only for the asterisk: async-validator does not run its own required check when a
        // validator is given, so the message stays the schema's.
        required: !fieldSchema.safeParse(undefined).success,
        trigger,
        validator: (_rule, value, callback) => {
          const own = fieldSchema.safeParse(value);
          if (!own.success) return callback(new Error(own.error.issues[0]?.message ?? 'invalid value'));
          if (options.model) {
            const whole = schema.safeParse(options.model());
            const issue = whole.success ? undefined : whole.error.issues.find((i) => i.path[0] === key);
            if (issue) return callback(new Error(issue.message));
          }
          callback();
        },
      },
    ];
  }
  return rules as Partial<Record<keyof S['shape'] & string, FormItemRule[]>>;
}
