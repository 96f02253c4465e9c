import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const checkoutRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
