import { fileURLToPath } from 'node:url';

export const ROOT = fileURLToPath(new URL('../..', import.meta.url));
export const TMP_ROOT = fileURLToPath(new URL('../.tmp/', import.meta.url));
export const TEMPLATE_DB = `${TMP_ROOT}template.db`;
export const DEMO_PASSWORD = 'throwline-demo';
export const DEMO = {
  admin: 'admin@throwline.test',
  manager: 'manager@throwline.test',
  engineer: 'engineer@throwline.test',
  viewer: 'viewer@throwline.test',
  otherManager: 'othermanager@throwline.test',
} as const;
