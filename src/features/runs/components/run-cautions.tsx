import { Alert } from '@/components/ui/feedback';

/** The reminder shown wherever estimates are read. */
export function RunCautions() {
  return (
    <Alert tone="warning" title="Read estimates with care">
      These estimates summarise stated, hypothetical choices, not observed behaviour. They carry
      sampling and simulation error, and policy or health decisions should not rest on one study
      alone.
    </Alert>
  );
}
