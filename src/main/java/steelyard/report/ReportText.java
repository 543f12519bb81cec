package steelyard.report;

import java.util.List;
import java.util.Locale;
import steelyard.text.Unit;

/** Wording shared by the text reports. */
public final class ReportText {
  /** Printed at the end of every report that shows picked transcripts or their error rates. */
  public static final String REVIEW_NOTE =
      "An automatic pick is not a verified transcript; transcripts with legal, medical or safety weight need review by a person.";

  /** How many ids a text report lists before summarising the rest. */
  public static final int MAX_IDS = 10;

  private ReportText() {}

  /** {@code WER} or {@code CER}. */
  public static String rateName(Unit unit) {
    return unit == Unit.CHAR ? "CER" : "WER";
  }

  /** {@code words} or {@code characters}. */
  public static String tokenNoun(Unit unit) {
    return unit == Unit.CHAR ? "characters" : "words";
  }

  /** {@code word} or {@code char}, as on the command line. */
  public static String unitLabel(Unit unit) {
    return unit.name().toLowerCase(Locale.ROOT);
  }

  /** Up to {@link #MAX_IDS} ids joined by ", ", then {@code "… and N more"}. */
  public static String ids(List<String> ids) {
    StringBuilder sb = new StringBuilder();
    for (int i = 0; i < ids.size() && i < MAX_IDS; i++) {
      if (i > 0) sb.append(", ");
      sb.append(ids.get(i));
    }
    if (ids.size() > MAX_IDS) sb.append(" … and ").append(ids.size() - MAX_IDS).append(" more");
    return sb.toString();
  }

  /** A token for display: the empty token as {@code ∅}, otherwise itself. */
  public static String token(String t) {
    return t.isEmpty() ? "∅" : t;
  }
}
