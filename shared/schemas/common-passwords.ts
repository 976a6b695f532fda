/**
 * Passwords of 12 or more characters that appear near the top of public breached-password
 * frequency lists (common practice: refuse the most common ones; NIST SP 800-63B §5.1.1.2
 * asks verifiers to check against such a list). Compared case-insensitively.
 */
export const COMMON_PASSWORDS: ReadonlySet<string> = new Set([
  '123456789012', '1234567890123', '12345678901234', '123456789123', '111111111111',
  '000000000000', '123123123123', '123412341234', '987654321098', '121212121212',
  'password1234', 'password12345', 'password123456', 'passwordpassword', 'password1234!',
  'qwertyuiop12', 'qwertyuiop123', 'qwerty123456', 'qwertyqwerty', '1qaz2wsx3edc',
  'qazwsxedcrfv', 'asdfghjkl123', 'zxcvbnm12345', 'iloveyou1234', 'welcome12345',
  'letmein12345', 'administrator', 'administrator1', 'changeme1234', 'abcdefghijkl',
  'abc123456789', 'abcd12345678', 'football1234', 'baseball1234', 'sunshine1234',
  'princess1234', 'monkey123456', 'dragon123456', 'trustno1trustno1', 'superman1234',
  'starwars1234', 'whatever1234', 'mypassword12', 'mypassword123', 'secret123456',
  'computer1234', 'internet1234', 'access123456', 'master123456', 'aaaaaaaaaaaa',
]);
