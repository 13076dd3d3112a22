/**
 * Sweep one attribute of one alternative (by default the cost of the first) across its range
 * and draw that alternative's share with its interval — a demand curve — computed in the
 * browser from the run's share model (shared/engine/shares/demand-curve.ts), with downloads.
 */
import { useMemo, useRef, useState } from 'react';
import type { Chart } from 'chart.js';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/field';
import { Alert } from '@/components/ui/feedback';
import { formatAmount, formatInterval, formatPercent } from '@/utils/format';
import { ScenarioError } from '@shared/engine/shares/code-scenario';
import { sweepDemandCurve, type DemandCurve } from '@shared/engine/shares/demand-curve';
import type { PreparedShareModel } from '@shared/engine/shares/share-model';
import type { ScenarioAlternative, ShareExportInput } from '@shared/schemas/shares';
import { getLevelLabel } from '@shared/study/level-labels';
import { DemandCurveChart } from './demand-curve-chart';
import { ShareDownloads } from './share-downloads';
import { DataTable, figureHeading } from '@/components/ui/data-table';
import { Options } from '@/components/ui/options';

const pct = (x: number | null | undefined) => formatPercent(x, 1);

export function DemandCurveCard({
  prepared,
  alternatives,
  includeFixed,
  request,
}: {
  prepared: PreparedShareModel;
  alternatives: ScenarioAlternative[];
  includeFixed: boolean;
  /** The scenario as the server's export takes it (run, name, segments). */
  request: Omit<ShareExportInput, 'format' | 'sweep'>;
}) {
  const definition = prepared.model.definition;
  const cost = definition.attributes.find((a) => a.isCost) ?? definition.attributes[0];
  const [on, setOn] = useState(false);
  const [alternative, setAlternative] = useState(0);
  const [attributeId, setAttributeId] = useState(cost.id);
  const chart = useRef<Chart | null>(null);
  const at = Math.min(alternative, alternatives.length - 1);
  const sweep = { alternative: at, attributeId, points: 11 };
  const outcome = useMemo((): { curve: DemandCurve | null; error: string | null } => {
    if (!on) return { curve: null, error: null };
    try {
      return {
        curve: sweepDemandCurve(prepared, { alternatives, includeFixed }, sweep),
        error: null,
      };
    } catch (e) {
      if (e instanceof ScenarioError) return { curve: null, error: e.message };
      throw e;
    }
    // sweep is rebuilt from its parts on every render; list the parts.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [on, prepared, alternatives, includeFixed, at, attributeId]);
  const attribute = definition.attributes.find((a) => a.id === attributeId) ?? cost;
  const curve = outcome.curve;
  const labels = curve
    ? curve.points.map((p) => {
        const level = p.levelId ? attribute.levels.find((l) => l.id === p.levelId) : undefined;
        return level
          ? getLevelLabel(attribute, level)
          : formatAmount(p.value, attribute.unit, 2, true);
      })
    : [];
  const name = alternatives[at]?.name ?? '';
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end gap-3">
        <SelectField
          label="Alternative"
          value={at}
          onChange={(e) => setAlternative(Number(e.target.value))}
          wrapperClassName="w-full sm:w-56"
        >
          {alternatives.map((a, i) => (
            <option key={i} value={i}>
              {a.name}
            </option>
          ))}
        </SelectField>
        <SelectField
          label="Attribute to sweep"
          value={attributeId}
          onChange={(e) => setAttributeId(e.target.value)}
          wrapperClassName="w-full sm:w-72"
        >
          <Options items={definition.attributes.map((a) => ({ value: a.id, label: a.name }))} />
        </SelectField>
        {!on && <Button onClick={() => setOn(true)}>Draw the demand curve</Button>}
      </div>
      {outcome.error && <Alert tone="warning">{outcome.error}</Alert>}
      {curve && (
        <>
          <DemandCurveChart
            curve={curve}
            labels={labels}
            axisTitle={attribute.name}
            alternativeName={name}
            chartRef={chart}
          />
          <p className="text-xs text-ink-muted">
            {curve.scale === 'linear'
              ? `${attribute.name} from its lowest to its highest level in ${curve.points.length - 1} equal steps; everything else as in the scenario. Between the levels the model's linear utility is used; outside them nothing is shown.`
              : `One point per level of ${attribute.name}; everything else as in the scenario.`}{' '}
            The band is the 95 % interval described under the shares.
          </p>
          <details className="text-sm">
            <summary className="cursor-pointer text-ink-soft">The curve as a table</summary>
            <DataTable
              wrapperClassName="mt-2 overflow-x-auto"
              className="min-w-full"
              bodyClassName="font-mono tabular-nums"
              headings={[
                { label: attribute.name, align: 'left', key: 'level' },
                figureHeading(`Share of ${name}`),
                figureHeading('95 % interval'),
              ]}
            >
              {curve.points.map((p, i) => (
                <tr key={i} className="border-b border-line/60">
                  <td className="px-2 py-1 font-sans">{labels[i]}</td>
                  <td className="px-2 py-1 text-right">{pct(p.share)}</td>
                  <td className="px-2 py-1 text-right whitespace-nowrap">
                    {formatInterval(p.lower, p.upper, pct)}
                  </td>
                </tr>
              ))}
            </DataTable>
          </details>
          <ShareDownloads
            what="demand curve"
            request={{ ...request, sweep }}
            chart={chart}
            pngName={`demand-curve-${attribute.id}.png`}
          />
        </>
      )}
    </div>
  );
}
