/** The second step of signing in: a code from the authenticator app, or a recovery code. */
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { secondStepSchema, type SecondStepInput } from '@shared/schemas/two-step';
import { TextField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { useSecondStep } from '../api/sign-in';
import { FormError } from './form-error';
import { applyServerError } from '@/lib/submit-form';
import { formField } from '@/components/ui/form-field';

export function SecondStepForm({
  onSignedIn,
  onStartAgain,
}: {
  onSignedIn: () => void;
  onStartAgain: () => void;
}) {
  const secondStep = useSecondStep();
  const [recovery, setRecovery] = useState(false);
  const form = useForm<SecondStepInput>({
    resolver: zodResolver(secondStepSchema),
    defaultValues: { code: '' },
  });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await secondStep.mutateAsync(values);
      onSignedIn();
    } catch (err) {
      applyServerError(err, form.setError);
    }
  });

  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate aria-label="Second step">
      <p className="text-sm text-ink-soft">
        {recovery
          ? 'Enter one of the recovery codes you saved when you turned on two-step sign-in. Each works once.'
          : 'Open the authenticator app on your phone and enter the 6-digit code it shows for Choicewright.'}
      </p>
      <TextField
        key={recovery ? 'recovery' : 'app'}
        label={recovery ? 'Recovery code' : 'Code from the app'}
        inputMode={recovery ? 'text' : 'numeric'}
        autoComplete="one-time-code"
        autoFocus
        className="font-mono tracking-widest"
        {...formField(form, 'code')}
      />
      <FormError message={errors.root?.server?.message} />
      <Button type="submit" className="w-full" busy={isSubmitting}>
        Sign in
      </Button>
      <div className="flex flex-wrap justify-between gap-2 text-sm">
        <button
          type="button"
          className="text-primary underline"
          onClick={() => {
            setRecovery(!recovery);
            form.reset({ code: '' });
          }}
        >
          {recovery ? 'Use a code from the app' : 'Use a recovery code instead'}
        </button>
        <button type="button" className="text-primary underline" onClick={onStartAgain}>
          Start again
        </button>
      </div>
    </form>
  );
}
