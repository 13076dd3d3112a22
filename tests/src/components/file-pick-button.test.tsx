// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { FilePickButton } from '@/components/ui/file-pick-button';

afterEach(cleanup);

const csv = () => new File(['a,b\n1,2\n'], 'design.csv', { type: 'text/csv' });

describe('FilePickButton', () => {
  it('is named by its text and reports each pick, the same file twice as well', async () => {
    const onFile = vi.fn();
    render(
      <FilePickButton className="btn" accept=".csv,text/csv" onFile={onFile}>
        Import design from CSV
      </FilePickButton>,
    );
    const input = screen.getByLabelText('Import design from CSV');
    expect(input).toHaveAttribute('type', 'file');
    expect(input).toHaveAttribute('accept', '.csv,text/csv');
    const user = userEvent.setup();
    const file = csv();
    await user.upload(input, file);
    await user.upload(input, file);
    expect(onFile.mock.calls).toEqual([[file], [file]]);
    expect((input as HTMLInputElement).value).toBe('');
  });

  it('takes the input name from inputLabel and reports nothing while disabled', async () => {
    const onFile = vi.fn();
    render(
      <FilePickButton
        className="btn"
        accept=".csv"
        onFile={onFile}
        disabled
        inputLabel="Import a file into French"
      >
        Import a file
      </FilePickButton>,
    );
    const input = screen.getByLabelText('Import a file into French');
    expect(input).toBeDisabled();
    await userEvent.setup().upload(input, csv());
    expect(onFile).not.toHaveBeenCalled();
  });
});
