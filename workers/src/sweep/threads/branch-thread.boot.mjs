// Worker-thread bootstrap: registers the TypeScript loader in this thread, then loads the
// branch runner. Plain JS so it loads without a loader, whatever started the parent.
import { register } from 'tsx/esm/api';

register();
await import('./branch-thread.ts');
