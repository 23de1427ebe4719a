/** What the Content-Security-Policy allows beyond this site's own origin. */
export type HeaderOptions = {
  /** `next dev`: fast refresh evaluates code, so 'unsafe-eval' is allowed there and nowhere else. */
  development: boolean;
  /** The public address is https: upgrade-insecure-requests and Strict-Transport-Security. */
  https: boolean;
  /** Where uploaded photos are served from (img-src). */
  imageOrigins: string[];
  /** Where the browser sends uploads (connect-src). */
  uploadOrigins: string[];
  /** The payment provider's hosted checkout and onboarding pages (form-action, for redirects after a form post). */
  paymentPageOrigins: string[];
};

export declare const LOCAL_STAND_INS: string[];
export declare function headerOptionsFromEnv(env: Record<string, string | undefined>): HeaderOptions;
export declare function contentSecurityPolicy(options: HeaderOptions): string;
export declare function securityHeaders(options: HeaderOptions): { key: string; value: string }[];
