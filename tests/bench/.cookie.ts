import { writeFileSync } from 'node:fs';
import { DEMO } from '../helpers/paths';
import { signIn } from '../helpers/session';
const c = await signIn('http://127.0.0.1:4711', DEMO.manager);
writeFileSync('/tmp/tl/prof/cookie', c.jar.header());
const { venues } = await (await c.fetch('/api/venues')).json();
console.log(venues.map((v: any) => v.slug));
