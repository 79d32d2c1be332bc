import { Alert, Button, List } from '@mantine/core';
import { describeError } from '../lib/api-error';

interface ErrorNoticeProps {
  error: unknown;
  title?: string;
  onRetry?: () => void;
}

/** An inline failure: the server's message and, for validation failures, each detail. */
export function ErrorNotice({ error, title = 'That did not work', onRetry }: ErrorNoticeProps) {
  const { message, details } = describeError(error);
  return (
    <Alert color="ember" title={title} role="alert" variant="light">
      {message}
      {details.length > 0 && (
        <List size="sm" mt="xs">
          {details.map((detail) => (
            <List.Item key={detail}>{detail}</List.Item>
          ))}
        </List>
      )}
      {onRetry && (
        <Button size="xs" variant="light" color="ember" mt="sm" onClick={onRetry}>
          Try again
        </Button>
      )}
    </Alert>
  );
}
