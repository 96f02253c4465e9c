import type { UseFormRegisterReturn } from 'react-hook-form';
import { FormField, inputClass } from '../../../components/form-field';

type Props = {
  password: UseFormRegisterReturn;
  confirm: UseFormRegisterReturn;
  errors: { password?: { message?: string }; confirm?: { message?: string } };
  labels: { password: string; confirm: string };
  hint?: string;
};

/** The password and its repetition, as set when accepting an invitation or after a reset link. */
export function NewPasswordFields({ password, confirm, errors, labels, hint }: Props) {
  return (
    <>
      <FormField id="password" label={labels.password} hint={hint} error={errors.password?.message}>
        {(a11y) => <input {...a11y} type="password" autoComplete="new-password" className={inputClass} {...password} />}
      </FormField>
      <FormField id="confirm" label={labels.confirm} error={errors.confirm?.message}>
        {(a11y) => <input {...a11y} type="password" autoComplete="new-password" className={inputClass} {...confirm} />}
      </FormField>
    </>
  );
}
