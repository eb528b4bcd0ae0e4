// The most common passwords, written down from memory of the widely published common-password
// lists (leaked-password top-N lists that security write-ups reprint every year), lower-cased.
// Deliberately short: the length rule already rules out most of the well-known ones; this list
// catches the long-enough ones people still choose, plus this site's own name.
export const COMMON_PASSWORDS: ReadonlySet<string> = new Set([
  "123456", "123456789", "12345678", "1234567890", "12345", "1234567", "111111", "123123", "000000",
  "password", "password1", "password12", "password123", "password1234", "passw0rd", "p@ssw0rd", "p@ssword",
  "qwerty", "qwerty123", "qwertyuiop", "qwerty12345", "1q2w3e4r", "1q2w3e4r5t", "1qaz2wsx", "zaq12wsx",
  "asdfghjkl", "zxcvbnm", "abc123", "abcd1234", "iloveyou", "iloveyou1", "letmein", "letmein123",
  "welcome", "welcome1", "welcome123", "admin", "admin123", "administrator", "monkey", "dragon",
  "football", "baseball", "sunshine", "princess", "superman", "starwars", "trustno1", "whatever",
  "shadow", "master", "michael", "jennifer", "charlie", "liverpool", "chelsea", "arsenal",
  "changeme", "changeme123", "secret", "secret123", "computer", "internet", "login", "freedom",
  "mustang", "jordan23", "harley", "hunter2", "batman", "pokemon", "google", "samsung",
  "0987654321", "987654321", "1111111111", "0000000000", "123321", "654321", "666666", "7777777",
  "12341234", "11111111", "88888888", "123123123", "1234512345", "qwertyqwerty", "passwordpassword",
  "iloveyou123", "football123", "princess123", "sunshine123", "summer2024", "summer2025", "winter2025",
  "spring2026", "autumn2025", "fiddle", "fiddle123", "violin", "violin123", "rosinwood", "rosinwood1",
  "rosinwood123",
]);
