/**
 * On the web, what the page opened at needs is asked for before the app first draws
 * (early-arrival.web.ts). A phone's app has its code on board and nothing to start early.
 */
export function startEarlyArrival(): void {}
