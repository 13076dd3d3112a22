/**
 * Recovery codes, shown once right after they are made: the server keeps only their hashes, so
 * this is the one chance to save them (download as a text file, or copy).
 */
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Alert } from '@/components/ui/feedback';

export function RecoveryCodesPanel({ codes, onDone }: { codes: string[]; onDone: () => void }) {
  const [copied, setCopied] = useState(false);
  const text = `Choicewright recovery codes (each works once)\n\n${codes.join('\n')}\n`;

  const download = () => {
    const url = URL.createObjectURL(new Blob([text], { type: 'text/plain' }));
    const a = Object.assign(document.createElement('a'), {
      href: url,
      download: 'choicewright-recovery-codes.txt',
    });
    a.click();
    URL.revokeObjectURL(url);
  };
  const copy = async () => {
    await navigator.clipboard.writeText(text);
    setCopied(true);
  };

  return (
    <div className="space-y-4">
      <Alert tone="warning" title="Save these recovery codes now">
        If you lose your phone, each code signs you in once instead of a code from the app. They are
        not shown again: keep them somewhere safe, away from your password.
      </Alert>
      <ol
        aria-label="Recovery codes"
        className="grid grid-cols-1 gap-2 rounded-md border border-line bg-canvas p-4 font-mono text-sm sm:grid-cols-2"
      >
        {codes.map((c) => (
          <li key={c}>{c}</li>
        ))}
      </ol>
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" onClick={download}>
          Download as text
        </Button>
        <Button variant="secondary" onClick={() => void copy()}>
          {copied ? 'Copied' : 'Copy'}
        </Button>
        <Button onClick={onDone}>I have saved them</Button>
      </div>
    </div>
  );
}
