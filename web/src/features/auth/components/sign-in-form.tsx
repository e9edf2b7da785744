import { zodResolver } from '@hookform/resolvers/zod';
import { type TLoginRequest, ZLoginRequest } from '@shared/contracts/auth';
import { Alert } from '@web/components/alert';
import { Button } from '@web/components/button';
import { FormField } from '@web/components/form-field';
import { TextInput } from '@web/components/inputs';
import { isApiError } from '@web/lib/api-client';
import { LogIn } from 'lucide-react';
import { useForm } from 'react-hook-form';
import { useLogin } from '../api/login';

/** One message for every credential failure, so the form never reveals which accounts exist. */
function describeSignInError(error: unknown): string {
  if (isApiError(error)) {
    if (error.status === 429) return 'Too many attempts, wait a minute.';
    if (error.status === 401 || error.status === 400)
      return 'That e-mail and password do not match an active account.';
    if (error.code === 'network_error') return error.message;
  }
  return 'Sign-in is not available right now. Try again shortly.';
}

export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const loginMutation = useLogin();
  const form = useForm<TLoginRequest>({
    resolver: zodResolver(ZLoginRequest),
    defaultValues: { email: '', password: '' },
  });
  const { errors } = form.formState;

  const submit = form.handleSubmit((values) => loginMutation.mutate(values, { onSuccess: onSignedIn }));

  return (
    <form onSubmit={submit} noValidate className="space-y-4">
      {loginMutation.isError && <Alert>{describeSignInError(loginMutation.error)}</Alert>}
      <FormField label="E-mail" error={errors.email?.message}>
        {(control) => (
          <TextInput
            {...control}
            type="email"
            autoComplete="username"
            autoFocus
            {...form.register('email')}
          />
        )}
      </FormField>
      <FormField label="Password" error={errors.password?.message}>
        {(control) => (
          <TextInput
            {...control}
            type="password"
            autoComplete="current-password"
            {...form.register('password')}
          />
        )}
      </FormField>
      <Button
        type="submit"
        variant="primary"
        icon={LogIn}
        isBusy={loginMutation.isPending}
        className="w-full"
      >
        Sign in
      </Button>
    </form>
  );
}
