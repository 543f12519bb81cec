package steelyard.lm.train;

import java.util.Locale;

/** The estimation methods {@link Trainer} offers. */
public enum Smoothing {
  /** Interpolated modified Kneser-Ney (Chen &amp; Goodman 1998): three discounts per order, continuation counts. */
  MKN,
  /** Interpolated Witten-Bell: the back-off weight grows with the number of distinct followers. */
  WB,
  /** Interpolated absolute discounting: one discount per order, D = n1 / (n1 + 2·n2). */
  ABS,
  /** Add-k (additive) smoothing; in memory only, since it has no exact back-off (ARPA) form. */
  ADDK;

  /** The lower-case name used on the command line and in model metadata. */
  public String key() {
    return name().toLowerCase(Locale.ROOT);
  }

  /** The method's name in words, e.g. {@code interpolated modified Kneser-Ney}. */
  public String title() {
    return switch (this) {
      case MKN -> "interpolated modified Kneser-Ney";
      case WB -> "interpolated Witten-Bell";
      case ABS -> "interpolated absolute discounting";
      case ADDK -> "add-k";
    };
  }

  /** The method whose {@link #key()} is {@code key}, or null. */
  public static Smoothing ofKey(String key) {
    for (Smoothing s : values()) if (s.key().equals(key)) return s;
    return null;
  }

  /** Whether the result is an exact back-off model that can be written as an ARPA or binary file. */
  public boolean hasBackoffForm() {
    return this != ADDK;
  }
}
