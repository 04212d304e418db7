import { CheckboxField } from '@/components/ui/field';
import { useTheme } from '@/hooks/use-theme';
import { cn } from '@/utils/cn';
import type { TallySettings } from '../lib/settings';
import { Sheet } from './sheet';

function Choice<T extends string>({
  legend,
  value,
  options,
  onChange,
}: {
  legend: string;
  value: T;
  options: Array<{ value: T; label: string; hint: string }>;
  onChange: (v: T) => void;
}) {
  return (
    <fieldset>
      <legend className="mb-2 text-lg font-bold">{legend}</legend>
      <div className="grid gap-2">
        {options.map((o) => (
          <label
            key={o.value}
            className={cn(
              'flex min-h-14 cursor-pointer items-center gap-3 rounded-soft border-2 px-4 py-2',
              value === o.value
                ? 'border-moss bg-[#dce8df] text-ink'
                : 'border-wool bg-white dark:border-[#4a423c] dark:bg-[#332e2a]',
            )}
          >
            <input
              type="radio"
              className="h-6 w-6 accent-moss"
              checked={value === o.value}
              onChange={() => onChange(o.value)}
            />
            <span>
              <span className="block font-bold">{o.label}</span>
              <span className="block text-sm opacity-80">{o.hint}</span>
            </span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}

export function SettingsSheet({
  open,
  onClose,
  settings,
  onChange,
}: {
  open: boolean;
  onClose: () => void;
  settings: TallySettings;
  onChange: (patch: Partial<TallySettings>) => void;
}) {
  const { theme, setTheme } = useTheme();
  return (
    <Sheet open={open} onClose={onClose} title="Tally settings">
      <div className="flex flex-col gap-6">
        <Choice
          legend="Count by"
          value={settings.mode}
          onChange={(mode) => onChange({ mode })}
          options={[
            {
              value: 'stitch',
              label: 'Every stitch',
              hint: 'Each tap counts one stitch (one step of the round).',
            },
            {
              value: 'round',
              label: 'Whole rounds',
              hint: 'Each tap finishes the round; count the stitches yourself.',
            },
          ]}
        />
        <Choice
          legend="Theme"
          value={theme}
          onChange={setTheme}
          options={[
            { value: 'light', label: 'Light', hint: 'Oat paper, dark ink.' },
            { value: 'dark', label: 'Dark', hint: 'For evening work and dim rooms.' },
          ]}
        />
        <fieldset className="flex flex-col gap-1">
          <legend className="mb-1 text-lg font-bold">Screen and feel</legend>
          <CheckboxField
            label="High contrast"
            checked={settings.highContrast}
            onChange={(e) => onChange({ highContrast: e.currentTarget.checked })}
          />
          <CheckboxField
            label="Keep the screen awake while counting"
            checked={settings.keepAwake}
            onChange={(e) => onChange({ keepAwake: e.currentTarget.checked })}
          />
          <CheckboxField
            label="Short vibration on each tap (phones that can)"
            checked={settings.vibrate}
            onChange={(e) => onChange({ vibrate: e.currentTarget.checked })}
          />
          <CheckboxField
            label="Soft click sound on each tap"
            checked={settings.sound}
            onChange={(e) => onChange({ sound: e.currentTarget.checked })}
          />
        </fieldset>
        <section className="rounded-soft bg-wool/60 p-4 text-base dark:bg-white/5">
          <h3 className="mb-1 font-bold">Hands-free</h3>
          <p>
            A keyboard or a page-turner pedal works: <kbd className="font-bold">Space</kbd>,{' '}
            <kbd className="font-bold">Enter</kbd>, <kbd className="font-bold">→</kbd>,{' '}
            <kbd className="font-bold">↓</kbd> or <kbd className="font-bold">Page Down</kbd> count a stitch;{' '}
            <kbd className="font-bold">Backspace</kbd>, <kbd className="font-bold">←</kbd>,{' '}
            <kbd className="font-bold">↑</kbd> or <kbd className="font-bold">Page Up</kbd> undo.
          </p>
        </section>
      </div>
    </Sheet>
  );
}
