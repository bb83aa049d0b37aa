// The one place that configures zod for client and server: English messages a person can read.
// Named imports only, so the browser bundle keeps just the English locale (a namespace re-export
// would pull every language in).
import { config } from 'zod/mini';
import { en } from 'zod/locales';

config(en());
