// The sign-in fields' limits and messages, without zod: the sign-in page checks them in the browser
// as the server's signInSchema does, without shipping the schema library to the first page a phone loads.
export const EMAIL_MAX = 254;
export const PASSWORD_MAX = 200;
export const EMAIL_MESSAGE = 'Enter the e-mail address you were invited with.';
export const PASSWORD_MISSING = 'Enter your password.';
export const PASSWORD_TOO_LONG = 'That password is too long.';

// The shape of an address (something@something.tld), as strict as the form needs: the server decides.
const EMAIL_SHAPE = /^[^\s@]+@[^\s@]+\.[^\s@]+$/;

/** Field messages for what the server would refuse (empty when the input may be sent). */
export function signInProblems(email: string, password: string): { email?: string; password?: string } {
  const problems: { email?: string; password?: string } = {};
  const address = email.trim();
  if (!EMAIL_SHAPE.test(address) || address.length > EMAIL_MAX) problems.email = EMAIL_MESSAGE;
  if (password.length === 0) problems.password = PASSWORD_MISSING;
  else if (password.length > PASSWORD_MAX) problems.password = PASSWORD_TOO_LONG;
  return problems;
}
