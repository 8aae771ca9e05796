import type { FormErrors } from '@mantine/form';
import { issueMessage } from '@shuntwise/contracts';

interface SchemaIssue {
  code?: string;
  path: ReadonlyArray<PropertyKey>;
  message: string;
  minimum?: number | bigint;
  maximum?: number | bigint;
  values?: ReadonlyArray<unknown>;
  format?: string;
  origin?: string;
  inclusive?: boolean;
}

/** Anything with zod 4's `safeParse` (the contracts schemas). */
interface SafeParser {
  safeParse(values: unknown): { success: true } | { success: false; error: { issues: ReadonlyArray<SchemaIssue> } };
}

// zod's built-in messages ("Too small: expected string to have >=1 characters") are for
// developers; the contracts set their own where it matters, the rest are reworded here.
const ZOD_DEFAULT = /^(Too small|Too big|Invalid (input|option|string|format)|Required$)/;

function plainMessage(issue: SchemaIssue): string {
  if (!ZOD_DEFAULT.test(issue.message)) return issue.message;
  // Numbers: the field's label and the limit with its unit, from the contracts' one map.
  if (issue.origin === 'number' && (issue.code === 'too_small' || issue.code === 'too_big')) return issueMessage(issue);
  switch (issue.code) {
    case 'too_small':
      return Number(issue.minimum) <= 1 ? 'Required' : `Use at least ${issue.minimum} characters`;
    case 'too_big':
      return `Use at most ${issue.maximum} characters`;
    case 'invalid_value':
      return `Choose one of: ${(issue.values ?? []).join(', ')}`;
    case 'invalid_format':
      return issue.format === 'email' ? 'Enter a valid e-mail address' : 'Check the format';
    default:
      return 'Check this value';
  }
}

/**
 * Validates a Mantine form with a contracts schema. Mantine 7's built-in zodResolver
 * reads zod 3's `error.errors`; zod 4 reports `error.issues`, so this reads those.
 * Per field, a message the contracts wrote wins over zod's generic one.
 */
export function schemaResolver<T>(schema: SafeParser): (values: T) => FormErrors {
  return (values: T) => {
    const result = schema.safeParse(values);
    if (result.success) return {};
    const byField = new Map<string, SchemaIssue[]>();
    for (const issue of result.error.issues) {
      const key = issue.path.map(String).join('.');
      byField.set(key, [...(byField.get(key) ?? []), issue]);
    }
    const errors: FormErrors = {};
    for (const [key, issues] of byField) {
      const chosen = issues.find((i) => !ZOD_DEFAULT.test(i.message)) ?? issues[0];
      errors[key] = plainMessage(chosen);
    }
    return errors;
  };
}
