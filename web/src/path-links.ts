// Mailed links use the path form (/invite/<token>, /reset/<token>); the app routes with
// the hash. Imported first by main.tsx so the rewrite happens before the router exists.
const pathLink = /^\/(invite|reset)\/([^/]+)$/.exec(window.location.pathname);
if (pathLink) window.history.replaceState(null, '', `/#/${pathLink[1]}/${pathLink[2]}`);
