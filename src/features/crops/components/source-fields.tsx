import type { UseFormRegisterReturn } from 'react-hook-form';
import { z } from 'zod';
import { SourceTextSchema } from '@shared/schemas/crops';
import { TextField } from '@/components/ui/field';
import { Select } from '@/components/ui/select';

// A club value names where it comes from: one of the two marks, or a source in the club's own words
// (the server takes the words as they are, up to 60 characters, and shows them as "named by the club").

export const sourceKinds = ['common-practice', 'from-memory', 'other'] as const;
export type SourceKind = (typeof sourceKinds)[number];

const sourceKindLabels: Record<SourceKind, string> = {
  'common-practice': 'Common practice',
  'from-memory': 'From memory',
  other: 'Another source',
};

/** A form's value with the source select and the text box the "Another source" choice needs. */
export function sourcedFormSchema<T extends z.ZodType>(value: T) {
  return z
    .object({ value, sourceKind: z.enum(sourceKinds, { message: 'Choose where the value comes from' }), source: z.string() })
    .superRefine((v, ctx) => {
      if (v.sourceKind !== 'other') return;
      const text = SourceTextSchema.safeParse(v.source);
      if (!text.success) ctx.addIssue({ code: 'custom', message: text.error.issues[0]?.message ?? 'Name the source', path: ['source'] });
    });
}

/** What the server takes as the source: the mark, or the club's words. */
export function sourceOf(v: { sourceKind: SourceKind; source: string }): string {
  return v.sourceKind === 'other' ? v.source.trim() : v.sourceKind;
}

/** The select and text box to start from for a source already stored. */
export function sourceFormValues(source: string | undefined): { sourceKind: SourceKind; source: string } {
  if (source === 'common-practice' || source === 'from-memory' || source === undefined) return { sourceKind: source ?? 'common-practice', source: '' };
  return { sourceKind: 'other', source };
}

export interface SourceFieldsProps {
  /** Said in both labels, so several sources on one form have their own names. */
  what: string;
  kind: SourceKind;
  kindProps: UseFormRegisterReturn;
  textProps: UseFormRegisterReturn;
  kindError?: string;
  textError?: string;
}

/** "Where it comes from": the two marks or another source, whose name goes in a text box. */
export function SourceFields({ what, kind, kindProps, textProps, kindError, textError }: SourceFieldsProps) {
  return (
    <div className="flex flex-col gap-3">
      <Select label={`Source of the ${what}`} error={kindError} {...kindProps}>
        {sourceKinds.map((k) => (
          <option key={k} value={k}>
            {sourceKindLabels[k]}
          </option>
        ))}
      </Select>
      {kind === 'other' && (
        <TextField
          label={`Which source, for the ${what}`}
          hint="A publication and its table, or the club's own records; up to 60 characters."
          maxLength={60}
          error={textError}
          {...textProps}
        />
      )}
    </div>
  );
}
