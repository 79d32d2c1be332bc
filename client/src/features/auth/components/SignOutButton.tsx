import { Button } from '@mantine/core';
import { useSignOut } from '../api/use-sign-out';

export function SignOutButton() {
  const signOut = useSignOut();
  return (
    <Button variant="subtle" color="gray" size="compact-sm" loading={signOut.isPending} onClick={() => signOut.mutate()}>
      Sign out
    </Button>
  );
}
