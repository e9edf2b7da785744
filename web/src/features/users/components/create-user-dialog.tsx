import { zodResolver } from '@hookform/resolvers/zod';
import { type TCreateUserRequest, ZCreateUserRequest } from '@shared/contracts/users';
import { ROLE_LABELS, ROLES } from '@shared/roles';
import { Alert } from '@web/components/alert';
import { Button } from '@web/components/button';
import { Dialog } from '@web/components/dialog';
import { FormField } from '@web/components/form-field';
import { SelectInput, TextInput } from '@web/components/inputs';
import { applyServerErrors } from '@web/lib/form-errors';
import { UserPlus } from 'lucide-react';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { useCreateUser } from '../api/create-user';

const FIELDS = ['name', 'email', 'role', 'password'] as const;

interface CreateUserDialogProps {
  isOpen: boolean;
  onClose: () => void;
}

export function CreateUserDialog({ isOpen, onClose }: CreateUserDialogProps) {
  const createUser = useCreateUser();
  const [formError, setFormError] = useState<string>();
  const form = useForm<TCreateUserRequest>({
    resolver: zodResolver(ZCreateUserRequest),
    defaultValues: { name: '', email: '', role: 'investigator', password: '' },
  });
  const { errors } = form.formState;

  const close = () => {
    form.reset();
    createUser.reset();
    setFormError(undefined);
    onClose();
  };

  const submit = form.handleSubmit((values) => {
    setFormError(undefined);
    createUser.mutate(values, {
      onSuccess: close,
      onError: (error) => setFormError(applyServerErrors(error, FIELDS, form.setError)),
    });
  });

  return (
    <Dialog
      isOpen={isOpen}
      onClose={close}
      title="Add a user"
      description="They sign in with this e-mail and password; ask them to keep the password private."
    >
      <form onSubmit={submit} noValidate className="space-y-4">
        {formError && <Alert>{formError}</Alert>}
        <FormField label="Name" error={errors.name?.message}>
          {(control) => <TextInput {...control} autoComplete="off" {...form.register('name')} />}
        </FormField>
        <FormField label="E-mail" error={errors.email?.message}>
          {(control) => (
            <TextInput {...control} type="email" autoComplete="off" {...form.register('email')} />
          )}
        </FormField>
        <FormField label="Role" error={errors.role?.message}>
          {(control) => (
            <SelectInput {...control} {...form.register('role')}>
              {ROLES.map((role) => (
                <option key={role} value={role}>
                  {ROLE_LABELS[role]}
                </option>
              ))}
            </SelectInput>
          )}
        </FormField>
        <FormField label="Initial password" hint="At least 12 characters." error={errors.password?.message}>
          {(control) => (
            <TextInput
              {...control}
              type="password"
              autoComplete="new-password"
              {...form.register('password')}
            />
          )}
        </FormField>
        <div className="flex justify-end gap-2 pt-2">
          <Button onClick={close}>Cancel</Button>
          <Button type="submit" variant="primary" icon={UserPlus} isBusy={createUser.isPending}>
            Add user
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
