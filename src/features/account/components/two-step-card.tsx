/**
 * Two-step sign-in on the account page. Off: set it up (scan the QR code or type the key, then
 * confirm with a code from the app, which shows the recovery codes once). On: how many recovery
 * codes are left, new codes for a code from the app, or turn it off with the password and a code.
 */
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { QRCodeSVG } from 'qrcode.react';
import {
  disableTwoStepSchema,
  enableTwoStepSchema,
  type DisableTwoStepInput,
  type EnableTwoStepInput,
  type TwoStepSetup,
} from '@shared/schemas/two-step';
import { Button } from '@/components/ui/button';
import { Alert, Spinner } from '@/components/ui/feedback';
import { TextField } from '@/components/ui/field';
import { PasswordField } from '@/components/ui/auth-fields';
import { submitForm } from '@/lib/submit-form';
import {
  useDisableTwoStep,
  useEnableTwoStep,
  useRenewRecoveryCodes,
  useStartTwoStepSetup,
  useTwoStepStatus,
} from '../api/two-step';
import { RecoveryCodesPanel } from './recovery-codes-panel';
import { formatDate } from '@/utils/format';
import { formField } from '@/components/ui/form-field';

/** The key in groups of four, as authenticator apps show it, for typing by hand. */
const grouped = (secret: string) => secret.match(/.{1,4}/g)?.join(' ') ?? secret;

function AppCodeField({
  form,
  label = 'Code from the app',
}: {
  form: ReturnType<typeof useForm<EnableTwoStepInput>>;
  label?: string;
}) {
  return (
    <TextField
      label={label}
      inputMode="numeric"
      autoComplete="one-time-code"
      maxLength={6}
      className="max-w-40 font-mono tracking-widest"
      {...formField(form, 'code')}
    />
  );
}

/**
 * The form that sends one code from the app and gets a fresh set of recovery codes back: the
 * same exchange turns two-step sign-in on and renews the codes later.
 */
function useCodeForRecoveryCodes(
  send: (values: EnableTwoStepInput) => Promise<{ recoveryCodes: string[] }>,
  onCodes: (codes: string[]) => void,
) {
  const form = useForm<EnableTwoStepInput>({
    resolver: zodResolver(enableTwoStepSchema),
    defaultValues: { code: '' },
  });
  const onSubmit = submitForm(form, async (values) => {
    onCodes((await send(values)).recoveryCodes);
  });
  return { form, onSubmit };
}

function SetupSteps({
  setup,
  onEnabled,
}: {
  setup: TwoStepSetup;
  onEnabled: (c: string[]) => void;
}) {
  const enable = useEnableTwoStep();
  const { form, onSubmit } = useCodeForRecoveryCodes(enable.mutateAsync, onEnabled);
  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate aria-label="Set up two-step sign-in">
      <ol className="list-decimal space-y-4 ps-5 text-sm text-ink-soft">
        <li>
          <p>Scan this code with an authenticator app on your phone.</p>
          <div className="mt-3 inline-block rounded-md border border-line bg-white p-2">
            <QRCodeSVG
              value={setup.uri}
              size={168}
              marginSize={1}
              title="QR code for your authenticator app"
            />
          </div>
          <p className="mt-2">
            Cannot scan? Enter this key in the app instead (time-based):{' '}
            <code className="rounded bg-canvas px-1 font-mono text-ink">
              {grouped(setup.secret)}
            </code>
          </p>
        </li>
        <li>
          <p className="mb-2">Enter the 6-digit code the app now shows.</p>
          <AppCodeField form={form} />
        </li>
      </ol>
      {enable.isError && !form.formState.errors.code && (
        <Alert tone="danger">{enable.error.message}</Alert>
      )}
      <Button type="submit" busy={form.formState.isSubmitting}>
        Turn on two-step sign-in
      </Button>
    </form>
  );
}

function DisableForm({ onDone }: { onDone: () => void }) {
  const disable = useDisableTwoStep();
  const form = useForm<DisableTwoStepInput>({
    resolver: zodResolver(disableTwoStepSchema),
    defaultValues: { password: '', code: '' },
  });
  const { errors, isSubmitting } = form.formState;
  const onSubmit = submitForm(form, async (values) => {
    await disable.mutateAsync(values);
    onDone();
  });
  return (
    <form
      onSubmit={onSubmit}
      className="space-y-4"
      noValidate
      aria-label="Turn off two-step sign-in"
    >
      <PasswordField purpose="current" label="Your password" {...formField(form, 'password')} />
      <TextField
        label="Code from the app, or a recovery code"
        autoComplete="one-time-code"
        className="max-w-56 font-mono"
        {...formField(form, 'code')}
      />
      {disable.isError && !errors.password && !errors.code && (
        <Alert tone="danger">{disable.error.message}</Alert>
      )}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" variant="danger" busy={isSubmitting}>
          Turn off two-step sign-in
        </Button>
        <Button type="button" variant="ghost" onClick={onDone}>
          Keep it on
        </Button>
      </div>
    </form>
  );
}

function RenewForm({ onRenewed }: { onRenewed: (c: string[]) => void }) {
  const renew = useRenewRecoveryCodes();
  const { form, onSubmit } = useCodeForRecoveryCodes(renew.mutateAsync, onRenewed);
  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate aria-label="New recovery codes">
      <p className="text-sm text-ink-soft">The codes you have now stop working.</p>
      <AppCodeField form={form} />
      <Button type="submit" variant="secondary" busy={form.formState.isSubmitting}>
        Make new recovery codes
      </Button>
    </form>
  );
}

export function TwoStepCard() {
  const status = useTwoStepStatus();
  const start = useStartTwoStepSetup();
  const [codes, setCodes] = useState<string[] | null>(null);
  const [mode, setMode] = useState<'idle' | 'disable' | 'renew'>('idle');

  if (codes)
    return (
      <RecoveryCodesPanel
        codes={codes}
        onDone={() => {
          setCodes(null);
          setMode('idle');
          start.reset();
        }}
      />
    );
  if (status.isPending) return <Spinner />;
  if (status.error) return <Alert tone="danger">{status.error.message}</Alert>;

  if (!status.data.enabled)
    return (
      <div className="space-y-4">
        <p className="text-sm text-ink-soft">
          Off. With two-step sign-in, signing in also needs a code from an app on your phone, so a
          stolen password alone does not open your team&apos;s studies and respondents&apos; data.
        </p>
        {start.data ? (
          <SetupSteps setup={start.data} onEnabled={setCodes} />
        ) : (
          <Button busy={start.isPending} onClick={() => start.mutate()}>
            Set up two-step sign-in
          </Button>
        )}
        {start.isError && <Alert tone="danger">{start.error.message}</Alert>}
      </div>
    );

  const left = status.data.recoveryCodesLeft;
  return (
    <div className="space-y-4">
      <p className="text-sm text-ink-soft">
        <span className="font-medium text-success">On</span> since{' '}
        {formatDate(status.data.enabledAt)}. Signing in asks for a code from your authenticator app.{' '}
        {left} of 10 recovery codes left.
      </p>
      {left <= 3 && (
        <Alert tone="warning">Few recovery codes are left: make new ones while you can.</Alert>
      )}
      {mode === 'disable' && <DisableForm onDone={() => setMode('idle')} />}
      {mode === 'renew' && <RenewForm onRenewed={setCodes} />}
      {mode === 'idle' && (
        <div className="flex flex-wrap gap-2">
          <Button variant="secondary" onClick={() => setMode('renew')}>
            New recovery codes
          </Button>
          <Button variant="secondary" onClick={() => setMode('disable')}>
            Turn off
          </Button>
        </div>
      )}
    </div>
  );
}
