/** Import this first in a script that calls the app's domain functions (see kit-shims/hooks.mjs). */
import { register } from 'node:module';

register('./kit-shims/hooks.mjs', import.meta.url);
