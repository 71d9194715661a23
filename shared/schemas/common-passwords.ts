/**
 * Words and keyboard runs that people most often build passwords from, written for Tallyvolt (not copied from any
 * breach list). A password whose letters, once digits and symbols are taken off its ends and look-alike digits
 * read as letters, are one of these (or one repeated) is refused. Lower case, letters only.
 */
export const COMMON_PASSWORD_WORDS: readonly string[] = [
  // the product and its trade, which a user here reaches for first
  'tallyvolt', 'tally', 'volt', 'voltage', 'divider', 'resistor', 'battery', 'contactor', 'precharge', 'calibration',
  'engineer', 'engineering', 'electric', 'racing', 'formula', 'student', 'university', 'team', 'demo', 'example',
  // the usual words
  'password', 'passwort', 'passw', 'pass', 'passpass', 'secret', 'letmein', 'welcome', 'hello', 'helloworld', 'login',
  'admin', 'administrator', 'root', 'user', 'guest', 'test', 'tester', 'testing', 'default', 'changeme', 'temp',
  'master', 'iloveyou', 'loveyou', 'love', 'trustno', 'whatever', 'nothing', 'access', 'welcomeback', 'private',
  'monkey', 'dragon', 'shadow', 'sunshine', 'princess', 'football', 'baseball', 'soccer', 'hockey', 'basketball',
  'superman', 'batman', 'spiderman', 'starwars', 'pokemon', 'minecraft', 'freedom', 'flower', 'summer', 'winter',
  'spring', 'autumn', 'january', 'february', 'march', 'april', 'june', 'july', 'august', 'september', 'october',
  'november', 'december', 'monday', 'friday', 'sunday', 'computer', 'internet', 'michael', 'jennifer', 'jordan',
  'charlie', 'thomas', 'daniel', 'andrew', 'joshua', 'matthew', 'jessica', 'ashley', 'hunter', 'ranger', 'killer',
  'mustang', 'corvette', 'ferrari', 'porsche', 'harley', 'yamaha', 'chelsea', 'arsenal', 'liverpool', 'liverpoolfc',
  'cheese', 'chocolate', 'cookie', 'banana', 'orange', 'purple', 'yellow', 'silver', 'golden', 'diamond', 'angel',
  'blessed', 'jesus', 'christ', 'heaven', 'matrix', 'hacker', 'ninja', 'samurai', 'wizard', 'phoenix', 'tigger',
  'pepper', 'ginger', 'buster', 'maggie', 'bailey', 'lucky', 'happy', 'smile', 'qwerty', 'azerty', 'qwertz', 'abc',
  'abcdef', 'abcdefg', 'abcdefgh', 'abcdefghi', 'abcdefghij', 'abcdefghijk', 'abcdefghijkl', 'alphabet',
  'correcthorsebatterystaple', 'onetwothree', 'zaq', 'xsw', 'qaz', 'wsx',
  // keyboard runs
  'qwertyu', 'qwertyui', 'qwertyuio', 'qwertyuiop', 'asdf', 'asdfg', 'asdfgh', 'asdfghj', 'asdfghjk', 'asdfghjkl',
  'zxcv', 'zxcvb', 'zxcvbn', 'zxcvbnm', 'qwertyasdfgh', 'qwertyuiopasdfghjkl', 'asdfghjklzxcvbnm', 'qazwsx',
  'qazwsxedc', 'qazwsxedcrfv', 'zaqxsw', 'zaqwsx', 'zaqxswcde', 'qweasd', 'qweasdzxc', 'asdzxc', 'poiuytrewq',
  'lkjhgfdsa', 'mnbvcxz', 'ytrewq', 'iop', 'qwe', 'asd', 'zxc',
];

/** Whole passwords refused as typed (lower-cased), for shapes the word rule cannot see. */
export const COMMON_PASSWORDS: readonly string[] = [
  '123456789012', '1234567890123', '12345678901234', '123456123456', '123123123123', '111111111111', '000000000000',
  '121212121212', '123321123321', '112233445566', '987654321098', '1q2w3e4r5t6y', '1qaz2wsx3edc', 'q1w2e3r4t5y6',
  'a1b2c3d4e5f6', '1a2b3c4d5e6f', 'qwerty123456', '123456qwerty', 'password1234', 'qwertyuiop12', 'letmein12345',
  'welcome12345', 'iloveyou1234', 'abc123abc123', 'abcd1234abcd', 'p@ssw0rd1234', 'passw0rd1234', 'tallyvolt123',
  'tallyvolt1234', 'tallyvolt2026', 'tallyvolt!!!',
];
