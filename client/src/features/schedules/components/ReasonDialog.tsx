import { Button, Group, Modal, Stack, Textarea } from '@mantine/core';
import { useState, type ReactNode } from 'react';
import { ErrorNotice } from '../../../components/ErrorNotice';

interface ReasonDialogProps {
  title: string;
  label: string;
  confirm: string;
  required: boolean;
  pending: boolean;
  error: unknown;
  children?: ReactNode;
  onConfirm: (text: string) => void;
  onClose: () => void;
}

/** A small dialog asking for a comment or reason before an action (return, correct, submit). */
export function ReasonDialog({ title, label, confirm, required, pending, error, children, onConfirm, onClose }: ReasonDialogProps) {
  const [text, setText] = useState('');
  const [missing, setMissing] = useState(false);
  return (
    <Modal opened onClose={onClose} title={title} size="md">
      <form
        noValidate
        onSubmit={(event) => {
          event.preventDefault();
          if (required && text.trim() === '') return setMissing(true);
          onConfirm(text.trim());
        }}
      >
        <Stack gap="sm">
          {children}
          <Textarea
            label={label}
            withAsterisk={required}
            autosize
            minRows={3}
            maxLength={1000}
            value={text}
            error={missing ? 'Write a few words: it is kept with the revision' : undefined}
            onChange={(event) => {
              setText(event.currentTarget.value);
              setMissing(false);
            }}
            data-autofocus
          />
          {error !== null && error !== undefined && <ErrorNotice error={error} />}
          <Group justify="flex-end">
            <Button variant="default" onClick={onClose}>
              Cancel
            </Button>
            <Button type="submit" loading={pending}>
              {confirm}
            </Button>
          </Group>
        </Stack>
      </form>
    </Modal>
  );
}
