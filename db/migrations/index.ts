// Every migration, imported statically so the server bundle carries them
// (a folder scan does not survive bundling). Add new files here, in time order.
import type { Migration, MigrationProvider } from 'kysely';
import * as m0900 from './2026_12_01_0900_create_users_and_series';
import * as m0910 from './2026_12_01_0910_create_gags_and_beats';
import * as m0920 from './2026_12_01_0920_create_sign_in_failures';
import * as m1000 from './2026_12_01_1000_create_passes_and_strokes';
import * as m1100 from './2026_12_01_1100_create_review_loop';
import * as m1200 from './2026_12_01_1200_create_volumes';
import * as m1300 from './2026_12_01_1300_create_uploads';
import * as m20900 from './2026_12_02_0900_create_lightboxes';
import * as m21000 from './2026_12_02_1000_presence_per_tab';
import * as m31000 from './2026_12_03_1000_pass_size';
import * as m31100 from './2026_12_03_1100_sessions_and_sign_in_limits';
import * as m42000 from './2026_12_04_2000_matter_page_done';
import * as m42100 from './2026_12_04_2100_checklist_rechecks';
import * as m42110 from './2026_12_04_2110_invitation_replaced_by';
import * as m43000 from './2026_12_04_3000_create_final_pages';
import * as m43100 from './2026_12_04_3100_final_page_analyses';
import * as m51000 from './2026_12_05_1000_create_print_jobs';

export const migrations: Record<string, Migration> = {
  '2026_12_01_0900_create_users_and_series': m0900,
  '2026_12_01_0910_create_gags_and_beats': m0910,
  '2026_12_01_0920_create_sign_in_failures': m0920,
  '2026_12_01_1000_create_passes_and_strokes': m1000,
  '2026_12_01_1100_create_review_loop': m1100,
  '2026_12_01_1200_create_volumes': m1200,
  '2026_12_01_1300_create_uploads': m1300,
  '2026_12_02_0900_create_lightboxes': m20900,
  '2026_12_02_1000_presence_per_tab': m21000,
  '2026_12_03_1000_pass_size': m31000,
  '2026_12_03_1100_sessions_and_sign_in_limits': m31100,
  '2026_12_04_2000_matter_page_done': m42000,
  '2026_12_04_2100_checklist_rechecks': m42100,
  '2026_12_04_2110_invitation_replaced_by': m42110,
  '2026_12_04_3000_create_final_pages': m43000,
  '2026_12_04_3100_final_page_analyses': m43100,
  '2026_12_05_1000_create_print_jobs': m51000,
};

export const migrationProvider: MigrationProvider = {
  getMigrations: async () => migrations,
};
