/** Every entity the ORM knows, in one list (explicit, so tsc builds and tests discover the same). */
import { AuditEntry } from '../audit/entities/audit-entry.entity';
import { HandoverItem } from '../handover/entities/handover-item.entity';
import { HandoverNote } from '../handover/entities/handover-note.entity';
import { User } from '../users/entities/user.entity';
import { Zone } from '../zones/entities/zone.entity';

export const ENTITIES = [User, AuditEntry, Zone, HandoverNote, HandoverItem];
