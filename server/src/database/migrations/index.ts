/** The schema's history, in order. Add each new migration here as well. */
import { Migration20261201192005 } from './Migration20261201192005';
import { Migration20261201192644 } from './Migration20261201192644';
import { Migration20261201200000 } from './Migration20261201200000';
import { Migration20261201201000 } from './Migration20261201201000';
import { Migration20261201203510 } from './Migration20261201203510';
import { Migration20261202170000 } from './Migration20261202170000';
import { Migration20261202221500 } from './Migration20261202221500';
import { Migration20261202221600 } from './Migration20261202221600';
import { Migration20261202230000 } from './Migration20261202230000';
import { Migration20261202230100 } from './Migration20261202230100';
import { Migration20261203050000 } from './Migration20261203050000';
import { Migration20261203050500 } from './Migration20261203050500';
import { Migration20261203120000 } from './Migration20261203120000';
import { Migration20261204100001 } from './Migration20261204100001';
import { Migration20261204100002 } from './Migration20261204100002';

export const MIGRATIONS = [
  { name: 'Migration20261201192005', class: Migration20261201192005 },
  { name: 'Migration20261201192644', class: Migration20261201192644 },
  { name: 'Migration20261201200000', class: Migration20261201200000 },
  { name: 'Migration20261201201000', class: Migration20261201201000 },
  { name: 'Migration20261201203510', class: Migration20261201203510 },
  { name: 'Migration20261202170000', class: Migration20261202170000 },
  { name: 'Migration20261202221500', class: Migration20261202221500 },
  { name: 'Migration20261202221600', class: Migration20261202221600 },
  { name: 'Migration20261202230000', class: Migration20261202230000 },
  { name: 'Migration20261202230100', class: Migration20261202230100 },
  { name: 'Migration20261203050000', class: Migration20261203050000 },
  { name: 'Migration20261203050500', class: Migration20261203050500 },
  { name: 'Migration20261203120000', class: Migration20261203120000 },
  { name: 'Migration20261204100001', class: Migration20261204100001 },
  { name: 'Migration20261204100002', class: Migration20261204100002 },
];
