package steelyard.demo;

/**
 * English number names as a speaker says them in the voice logs: {@code 44 → "forty four"},
 * {@code 115 → "one hundred and fifteen"}, times ({@code 6:45 → "six forty five"}) and digit-by-digit
 * readings of docket numbers ({@code 4807 → "four eight oh seven"}). Lowercase, words separated by one space.
 */
final class NumberWords {
  private static final String[] ONES = {
    "zero", "one", "two", "three", "four", "five", "six", "seven", "eight", "nine",
    "ten", "eleven", "twelve", "thirteen", "fourteen", "fifteen", "sixteen", "seventeen", "eighteen", "nineteen"
  };
  private static final String[] TENS = {"", "", "twenty", "thirty", "forty", "fifty", "sixty", "seventy", "eighty", "ninety"};

  private NumberWords() {}

  /** The cardinal 0 ≤ n ≤ 9999 in words. */
  static String cardinal(int n) {
    if (n < 0 || n > 9999) throw new IllegalArgumentException("out of range: " + n);
    if (n < 100) return belowHundred(n);
    StringBuilder sb = new StringBuilder();
    if (n >= 1000) {
      sb.append(ONES[n / 1000]).append(" thousand");
      n %= 1000;
      if (n == 0) return sb.toString();
      sb.append(n < 100 ? " and " : " ");
    }
    if (n >= 100) {
      sb.append(ONES[n / 100]).append(" hundred");
      n %= 100;
      if (n == 0) return sb.toString();
      sb.append(" and ");
    }
    return sb.append(belowHundred(n)).toString();
  }

  private static String belowHundred(int n) {
    if (n < 20) return ONES[n];
    return n % 10 == 0 ? TENS[n / 10] : TENS[n / 10] + " " + ONES[n % 10];
  }

  /** True for the words numbers are spoken with ({@code "forty"}, {@code "oh"}, {@code "hundred"}, …). */
  static boolean isNumberWord(String word) {
    for (String w : ONES) if (w.equals(word)) return true;
    for (String w : TENS) if (!w.isEmpty() && w.equals(word)) return true;
    return word.equals("oh") || word.equals("hundred") || word.equals("thousand");
  }

  /** A clock time as said aloud: {@code (7, 0) → "seven"}, {@code (6, 5) → "six oh five"}, {@code (9, 30) → "nine thirty"}. */
  static String time(int hour, int minute) {
    String h = belowHundred(hour == 0 ? 12 : hour > 12 ? hour - 12 : hour);
    if (minute == 0) return h;
    if (minute < 10) return h + " oh " + ONES[minute];
    return h + " " + belowHundred(minute);
  }

  /** Digits read one by one, zero read as "oh": {@code "4807" → "four eight oh seven"}. */
  static String digits(String digits) {
    StringBuilder sb = new StringBuilder();
    for (int i = 0; i < digits.length(); i++) {
      int d = digits.charAt(i) - '0';
      if (d < 0 || d > 9) throw new IllegalArgumentException("not a digit string: " + digits);
      if (sb.length() > 0) sb.append(' ');
      sb.append(d == 0 ? "oh" : ONES[d]);
    }
    return sb.toString();
  }

  /**
   * A four-digit number read in pairs, the usual way for docket numbers: {@code 4821 → "forty eight twenty one"},
   * {@code 4807 → "forty eight oh seven"}, {@code 4800 → "forty eight hundred"}.
   */
  static String pairs(int n) {
    if (n < 1000 || n > 9999) throw new IllegalArgumentException("not four digits: " + n);
    int hi = n / 100;
    int lo = n % 100;
    if (lo == 0) return belowHundred(hi) + " hundred";
    if (lo < 10) return belowHundred(hi) + " oh " + ONES[lo];
    return belowHundred(hi) + " " + belowHundred(lo);
  }
}
