package steelyard.demo;

import java.util.Locale;
import java.util.function.Function;

/**
 * Template grammar of the lines on scanned delivery dockets: mixed case, digits and the punctuation of printed
 * forms ({@code : / - ( ) . , #}), single spaces. Numbers are formatted with {@link Locale#ROOT}.
 */
final class DocketGrammar {
  private static final Function<DocketGrammar, String>[] TEMPLATES = templates();

  private final Dice dice;

  DocketGrammar(Dice dice) {
    this.dice = dice;
  }

  @SuppressWarnings("unchecked")
  private static Function<DocketGrammar, String>[] templates() {
    return new Function[] {
      (Function<DocketGrammar, String>) g -> g.field() + " " + g.docket() + " Date: " + g.date(),
      (Function<DocketGrammar, String>) g -> "Grower: " + g.grower() + " (G-" + g.dice.between(100, 480) + ")",
      (Function<DocketGrammar, String>) g -> "Lot " + g.lot() + " " + g.produce() + " " + g.dice.between(4, 60) + " x " + g.dice.between(5, 25) + " kg",
      (Function<DocketGrammar, String>) g -> g.grossTareNet(),
      (Function<DocketGrammar, String>) g -> "Received: Dock " + g.dice.between(1, 12) + " - Bay " + g.dice.between(1, 24) + " at " + g.clock(),
      (Function<DocketGrammar, String>) g -> "Cold Store " + g.dice.between(1, 6) + " / Rack " + g.dice.between(1, 30) + "-" + g.letter(),
      (Function<DocketGrammar, String>) g -> "Ripening Room " + g.dice.between(1, 8) + ": " + g.decimal(12, 22) + " C",
      (Function<DocketGrammar, String>) g -> g.dice.between(1, 26) + " pallets (" + g.dice.between(20, 960) + " cases) " + g.produce(),
      (Function<DocketGrammar, String>) g -> "Short " + g.dice.between(1, 9) + " " + g.container() + " - " + g.fault(),
      (Function<DocketGrammar, String>) g -> "Temp on arrival: " + g.decimal(1, 9) + " C",
      (Function<DocketGrammar, String>) g -> "Order " + g.dice.between(1000, 9999) + ": " + g.dice.between(1, 12) + " " + g.container() + " " + g.produce() + ", " + g.dice.between(1, 12) + " " + g.container() + " " + g.produce(),
      (Function<DocketGrammar, String>) g -> "Page " + g.dice.between(1, 2) + " of " + g.dice.between(2, 3),
      (Function<DocketGrammar, String>) g -> "Truck " + g.dice.between(1, 20) + " / Trailer " + g.plate(),
      (Function<DocketGrammar, String>) g -> "Checked by: " + g.initials() + " " + g.clock() + " " + g.weekday(),
      (Function<DocketGrammar, String>) g -> g.produce() + " " + g.variety() + " - Class " + (g.dice.chance(0.8) ? "I" : "II") + " - " + g.dice.between(2, 40) + " " + g.container(),
      (Function<DocketGrammar, String>) g -> "Despatch to: Bay " + g.dice.between(1, 24) + " (" + g.weekday() + " " + g.clock() + ")",
      (Function<DocketGrammar, String>) g -> "Rejected: " + g.dice.between(1, 40) + " " + g.container() + " " + g.produce() + " (" + g.fault() + ")",
      (Function<DocketGrammar, String>) g -> "Ref " + g.docket() + "/" + g.dice.between(1, 9) + " Lot " + g.lot(),
      (Function<DocketGrammar, String>) g -> Lexicon.COOPERATIVE + " - Goods Received",
      (Function<DocketGrammar, String>) g -> "Net " + g.dice.between(180, 9800) + " kg @ " + g.decimal(1, 6) + " /kg",
    };
  }

  String line() {
    return TEMPLATES[dice.below(TEMPLATES.length)].apply(this);
  }

  private String field() {
    return dice.pick(Lexicon.DOCKET_FIELDS);
  }

  private String docket() {
    String n = Integer.toString(dice.between(10000, 99999));
    return dice.chance(0.3) ? n + "-" + letter() : n;
  }

  private String date() {
    int day = dice.between(1, 28);
    int month = dice.between(1, 12);
    return String.format(Locale.ROOT, "%02d/%02d/%d", day, month, 2025 + dice.below(2));
  }

  private String clock() {
    return String.format(Locale.ROOT, "%02d:%02d", dice.between(4, 19), 5 * dice.below(12));
  }

  private String lot() {
    return String.format(Locale.ROOT, "%04d/%02d", dice.between(100, 9999), dice.between(1, 40));
  }

  private String decimal(int lo, int hi) {
    return dice.between(lo, hi) + "." + dice.below(10);
  }

  private String grossTareNet() {
    int tare = dice.between(20, 900);
    int net = dice.between(180, 9800);
    return "Gross " + (net + tare) + " kg Tare " + tare + " kg Net " + net + " kg";
  }

  private String letter() {
    return String.valueOf((char) ('A' + dice.below(8)));
  }

  private String plate() {
    StringBuilder sb = new StringBuilder();
    for (int i = 0; i < 3; i++) sb.append((char) ('A' + dice.below(26)));
    return sb.append('-').append(dice.between(1000, 9999)).toString();
  }

  private String initials() {
    return (char) ('A' + dice.below(26)) + "." + (char) ('A' + dice.below(26)) + ".";
  }

  private String grower() {
    return Lexicon.title(dice.pick(Lexicon.GROWER) + " " + dice.pick(Lexicon.GROWER_KIND));
  }

  private String produce() {
    String p = dice.pick(Lexicon.PRODUCE);
    return dice.chance(0.6) ? Lexicon.capitalise(p) : p;
  }

  private String variety() {
    return dice.pick(Lexicon.VARIETY);
  }

  private String container() {
    return dice.pick(Lexicon.DOCKET_CONTAINERS);
  }

  private String fault() {
    return dice.pick(Lexicon.FAULTS);
  }

  private String weekday() {
    return Lexicon.capitalise(dice.pick(Lexicon.DAYS).substring(0, 3));
  }
}
