import { CheckboxField } from '@/components/ui/field';

/** Seeing what one typed beats typing it twice on a phone keyboard, so forms offer this instead of a repeat field. */
export function ShowPassword({ shown, onChange }: { shown: boolean; onChange: (shown: boolean) => void }) {
  return <CheckboxField label="Show password" checked={shown} onChange={(e) => onChange(e.currentTarget.checked)} />;
}
