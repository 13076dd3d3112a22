// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { Button } from '@/components/ui/button';
import { useConfirm } from '@/components/ui/confirm-dialog';

afterEach(cleanup);

function Harness({ onResult }: { onResult: (ok: boolean) => void }) {
  const { confirm, dialog } = useConfirm();
  return (
    <>
      <Button
        onClick={() =>
          void confirm({
            title: 'Close the study?',
            body: 'Respondents still answering will be stopped.',
            confirmLabel: 'Close now',
            danger: true,
          }).then(onResult)
        }
      >
        Close
      </Button>
      {dialog}
    </>
  );
}

describe('useConfirm', () => {
  it('asks in a named dialog with the consequence, focuses Cancel, and answers true on confirm', async () => {
    const onResult = vi.fn();
    const confirmSpy = vi.spyOn(window, 'confirm');
    render(<Harness onResult={onResult} />);
    fireEvent.click(screen.getByRole('button', { name: 'Close' }));
    const dialog = await screen.findByRole('dialog', { name: 'Close the study?' });
    expect(dialog).toHaveAccessibleDescription('Respondents still answering will be stopped.');
    expect(screen.getByRole('button', { name: 'Cancel' })).toHaveFocus();
    fireEvent.click(screen.getByRole('button', { name: 'Close now' }));
    await vi.waitFor(() => expect(onResult).toHaveBeenCalledWith(true));
    expect(screen.queryByRole('dialog')).toBeNull();
    expect(confirmSpy).not.toHaveBeenCalled();
  });

  it('answers false on Cancel and on Escape', async () => {
    const onResult = vi.fn();
    render(<Harness onResult={onResult} />);
    fireEvent.click(screen.getByRole('button', { name: 'Close' }));
    fireEvent.click(await screen.findByRole('button', { name: 'Cancel' }));
    await vi.waitFor(() => expect(onResult).toHaveBeenLastCalledWith(false));
    fireEvent.click(screen.getByRole('button', { name: 'Close' }));
    fireEvent(await screen.findByRole('dialog'), new Event('cancel', { cancelable: true }));
    await vi.waitFor(() => expect(onResult).toHaveBeenCalledTimes(2));
    expect(onResult).toHaveBeenLastCalledWith(false);
    expect(screen.queryByRole('dialog')).toBeNull();
  });
});
