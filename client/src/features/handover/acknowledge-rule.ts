import { may, type HandoverNoteDto, type UserDto } from '@morrowline/shared';

/**
 * Who is offered "Acknowledge": an operator or supervisor of the incoming shift, never the
 * note's author, and only while nobody has. The server applies the same rule and has the last word.
 */
export function mayAcknowledge(user: Pick<UserDto, 'id' | 'role'>, note: Pick<HandoverNoteDto, 'author' | 'acknowledgedAt'>): boolean {
  if (note.acknowledgedAt !== null) return false;
  if (!may(user.role, 'forecast')) return false;
  return note.author.id !== user.id;
}

/** Writing a note is for the same two roles. */
export function mayWriteHandover(user: Pick<UserDto, 'role'>): boolean {
  return may(user.role, 'forecast');
}
