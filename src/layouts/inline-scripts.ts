import { createHash } from 'node:crypto';

/**
 * The two scripts every page runs inline, in the head: the theme before first paint (so a dark
 * room never gets a white flash), and the service worker that keeps the calculators usable
 * offline (public/sw.js; it stores nothing for signed-in pages).
 */
export const inlineScripts: readonly string[] = [
  `(function(){try{var s=localStorage.getItem('throwline-theme');var d=s?s==='dark':window.matchMedia('(prefers-color-scheme: dark)').matches;document.documentElement.dataset.theme=d?'dark':'light';}catch(e){}})();`,
  `if('serviceWorker' in navigator){window.addEventListener('load',function(){navigator.serviceWorker.register('/sw.js',{scope:'/'}).catch(function(){});});}`,
];

/** The CSP source for one inline script: its SHA-256, as the policy names it. */
export function inlineScriptHash(code: string): `sha256-${string}` {
  return `sha256-${createHash('sha256').update(code, 'utf8').digest('base64')}`;
}

/** Their hashes, worked out once per process rather than on every render. */
export const inlineScriptHashes: readonly `sha256-${string}`[] = inlineScripts.map(inlineScriptHash);
