import { fileURLToPath } from 'node:url';

export const ROOT = fileURLToPath(new URL('../..', import.meta.url));
/** One scratch folder per build folder, so side-by-side runs never share a template database. */
export const TMP_ROOT = fileURLToPath(new URL(`../.tmp/${process.env.THROWLINE_BUILD_DIR ?? 'dist'}/`, import.meta.url));
export const TEMPLATE_DB = `${TMP_ROOT}template.db`;
export const DEMO_PASSWORD = 'throwline-demo';
export const DEMO = {
  admin: 'admin@throwline.test',
  manager: 'manager@throwline.test',
  engineer: 'engineer@throwline.test',
  viewer: 'viewer@throwline.test',
  otherManager: 'othermanager@throwline.test',
} as const;
