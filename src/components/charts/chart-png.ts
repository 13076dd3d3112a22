/**
 * A chart as a PNG file: the canvas through toBlob, on a white background (a canvas is
 * transparent, which prints and pastes badly), saved under the given name.
 */
import type { Chart, Plugin } from 'chart.js';
import { saveFile } from '@/lib/save-file';

/** Paints the canvas white under the chart; register per chart through its `plugins` prop. */
export const whiteBackground: Plugin = {
  id: 'whiteBackground',
  beforeDraw(chart) {
    const { ctx, width, height } = chart;
    ctx.save();
    ctx.globalCompositeOperation = 'destination-over';
    ctx.fillStyle = '#ffffff';
    ctx.fillRect(0, 0, width, height);
    ctx.restore();
  },
};

export function saveChartPng(chart: Chart | null | undefined, filename: string): void {
  chart?.canvas.toBlob((blob) => {
    if (blob) saveFile({ blob, filename });
  }, 'image/png');
}
