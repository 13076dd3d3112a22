/** CSV, XLSX (built by the server from the same scenario) and PNG (the chart on screen). */
import type { RefObject } from 'react';
import type { Chart } from 'chart.js';
import { useParams } from 'react-router';
import { Button } from '@/components/ui/button';
import { ErrorText } from '@/components/ui/error-boundary';
import { saveChartPng } from '@/components/charts/chart-png';
import type { ShareExportInput } from '@shared/schemas/shares';
import { useExportShares } from '../api/export-shares';

export function ShareDownloads({
  what,
  request,
  chart,
  pngName,
}: {
  /** "shares" or "demand curve", for the buttons' accessible names. */
  what: string;
  request: Omit<ShareExportInput, 'format'>;
  chart: RefObject<Chart | null>;
  pngName: string;
}) {
  const { teamId = '', studyId = '' } = useParams();
  const download = useExportShares(teamId, studyId);
  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-center gap-2">
        <span className="text-xs text-ink-soft">Download:</span>
        {(['csv', 'xlsx'] as const).map((format) => (
          <Button
            key={format}
            variant="secondary"
            size="sm"
            aria-label={`Download the ${what} as ${format.toUpperCase()}`}
            busy={download.isPending && download.variables?.format === format}
            onClick={() => download.mutate({ ...request, format })}
          >
            {format.toUpperCase()}
          </Button>
        ))}
        <Button
          variant="secondary"
          size="sm"
          aria-label={`Download the ${what} chart as PNG`}
          onClick={() => saveChartPng(chart.current, pngName)}
        >
          PNG
        </Button>
      </div>
      <ErrorText error={download.error} />
    </div>
  );
}
