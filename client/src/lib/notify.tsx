import { List } from '@mantine/core';
import { notifications } from '@mantine/notifications';
import { describeError } from './api-error';

export function notifyFailure(title: string, error: unknown): void {
  const { message, details } = describeError(error);
  notifications.show({
    color: 'ember',
    title,
    autoClose: 8000,
    message: (
      <>
        {message}
        {details.length > 0 && (
          <List size="xs" mt={4}>
            {details.map((detail) => (
              <List.Item key={detail}>{detail}</List.Item>
            ))}
          </List>
        )}
      </>
    ),
  });
}

export function notifySuccess(message: string): void {
  notifications.show({ color: 'tide', message, autoClose: 4000 });
}
