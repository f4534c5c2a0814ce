// The password lengths of OWASP ASVS 4.0.3 V2.1, without zod, so a form can
// show them without loading the validation code (lib/validation/account.ts).

/** ASVS 2.1.1: at least 12 characters, after runs of spaces are counted as one. */
export const PASSWORD_MIN = 12;
/** ASVS 2.1.2: at least 64 must be allowed, more than 128 refused. */
export const PASSWORD_MAX = 128;
