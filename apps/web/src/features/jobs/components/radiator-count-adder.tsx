import { useState } from 'react';
import { panelTypes } from '@heatfleet/domain';
import { Button } from '@/components/ui/button';
import { NumberField } from '@/components/ui/number-field';
import { SegmentedChoice } from '@/components/ui/segmented-choice';
import {
  panelLabels,
  radiatorsByCount,
  sizePresetsFor,
  type PanelType,
  type RadiatorDraft,
} from '@/features/jobs/components/survey-draft';

const shortPanelLabels: Record<PanelType, string> = {
  single: 'Single',
  single_fins: 'Single + fins',
  double: 'Double',
  double_fins: 'Double + fins',
  column: 'Column',
  towel_rail: 'Towel rail',
  other: 'Other',
};

/**
 * The survey by count: a kind, a size and how many ("10 double panels 600 x 1000"), added in one go.
 * The kind and size stay chosen for the next row, the same as the one before; Enter in the count adds.
 */
export function RadiatorCountAdder({
  rows,
  onAdd,
}: {
  rows: readonly RadiatorDraft[];
  onAdd: (added: RadiatorDraft[]) => void;
}) {
  const [panel, setPanel] = useState<PanelType>('double');
  const [sizeKey, setSizeKey] = useState('600x1000');
  const [count, setCount] = useState('');
  const [error, setError] = useState<string | undefined>();
  const presets = sizePresetsFor(panel);
  const preset = presets.find((p) => p.key === sizeKey) ?? presets[presets.length - 1]!;
  const add = () => {
    const n = Number(count.trim());
    if (!Number.isInteger(n) || n < 1 || n > 80 - rows.length) {
      setError(`Give how many, from 1 to ${Math.max(1, 80 - rows.length)}.`);
      return;
    }
    setError(undefined);
    onAdd(radiatorsByCount(rows, panel, n, preset));
    setCount('');
  };
  return (
    <div
      role="group"
      aria-label="Add radiators by count"
      className="space-y-3 rounded-lg border-2 border-line-strong p-3"
    >
      <SegmentedChoice
        legend="Kind"
        columns={3}
        options={panelTypes.map((p) => ({ value: p, label: shortPanelLabels[p] }))}
        value={panel}
        onChange={(next) => {
          setPanel(next);
          if (!sizePresetsFor(next).some((p) => p.key === sizeKey)) setSizeKey(sizePresetsFor(next)[0]!.key);
        }}
      />
      <SegmentedChoice
        legend={panel === 'towel_rail' ? 'Size (height × width, mm)' : 'Size (height × length, mm)'}
        columns={3}
        options={presets.map((p) => ({ value: p.key, label: p.label }))}
        value={preset.key}
        onChange={setSizeKey}
      />
      <div className="grid grid-cols-[minmax(0,1fr)_auto] items-end gap-3">
        <NumberField
          label={`How many ${panelLabels[panel].toLowerCase()}s`}
          name="radiatorCount"
          whole
          enterKeyHint="done"
          value={count}
          onValueChange={setCount}
          onKeyDown={(event) => {
            if (event.key !== 'Enter') return;
            event.preventDefault();
            add();
          }}
          error={error}
        />
        <Button variant="secondary" className="min-h-12 border-2 border-brand-700" onClick={add}>
          Add them
        </Button>
      </div>
    </div>
  );
}
