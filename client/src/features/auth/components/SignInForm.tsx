import { Alert, Button, PasswordInput, Stack, TextInput } from '@mantine/core';
import { isEmail, isNotEmpty, useForm } from '@mantine/form';
import type { UserDto } from '@morrowline/shared';
import { useSignIn } from '../api/use-sign-in';
import { signInErrorMessage } from '../sign-in-messages';

interface SignInFormProps {
  onSignedIn: (user: UserDto) => void;
}

export function SignInForm({ onSignedIn }: SignInFormProps) {
  const signIn = useSignIn();
  const form = useForm({
    mode: 'uncontrolled',
    initialValues: { email: '', password: '' },
    validate: {
      email: isEmail('Enter your e-mail address'),
      password: isNotEmpty('Enter your password'),
    },
  });

  const submit = form.onSubmit((values) => {
    signIn.mutate(
      { email: values.email.trim(), password: values.password },
      {
        onSuccess: (response) => onSignedIn(response.user),
        // A failed attempt should not leave the password sitting in the field.
        onError: () => form.setFieldValue('password', ''),
      },
    );
  });

  return (
    <form onSubmit={submit} noValidate aria-label="Sign in">
      <Stack gap="md">
        {signIn.isError && (
          <Alert color="ember" variant="light" role="alert" data-testid="sign-in-error">
            {signInErrorMessage(signIn.error)}
          </Alert>
        )}
        <TextInput
          label="E-mail"
          type="email"
          autoComplete="username"
          autoFocus
          key={form.key('email')}
          {...form.getInputProps('email')}
        />
        <PasswordInput
          label="Password"
          autoComplete="current-password"
          key={form.key('password')}
          {...form.getInputProps('password')}
        />
        <Button type="submit" loading={signIn.isPending} fullWidth mt="xs">
          Sign in
        </Button>
      </Stack>
    </form>
  );
}
