export const ANY_FOLDER: string[];
export function contentSecurityPolicy(options?: { connectSrc?: readonly string[]; frameAncestors?: boolean; reportUri?: string | null }): string;
export function pageContentSecurityPolicy(folderOrigins?: readonly string[] | null): string;
export const PERMISSIONS_POLICY: string;
export const REFERRER_POLICY: string;
export function securityHeaders(options?: { connectSrc?: readonly string[]; reportUri?: string | null }): Record<string, string>;
export const FOLDER_CONTENT_SECURITY_POLICY: string;
