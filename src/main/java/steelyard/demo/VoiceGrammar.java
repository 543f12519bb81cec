package steelyard.demo;

import java.util.function.Function;

/**
 * Template grammar of the spoken voice logs: lowercase words separated by single spaces, numbers spelled out
 * ("forty four"), no punctuation. Each call of {@link #sentence} picks a template and fills its slots from
 * {@link Lexicon}.
 */
final class VoiceGrammar {
  private static final String[] OPENERS = {"okay", "right", "so", "yes", "alright", "note"};
  private static final String[] CLOSERS = {"thanks", "please", "over", "cheers", "thank you"};

  private static final Function<VoiceGrammar, String>[] TEMPLATES = templates();

  /**
   * Templates the corpus grammar never uses: the evaluation sets contain phrasings the domain corpus has not
   * seen, as in real use, so a domain LM helps without knowing every sentence shape.
   */
  private static final int[] HELD_OUT = {9, 20, 26, 29};

  private final Dice dice;
  private final boolean corpus;

  /** A grammar drawing from {@code dice}; {@code corpus} selects the corpus variant (without held-out templates). */
  VoiceGrammar(Dice dice, boolean corpus) {
    this.dice = dice;
    this.corpus = corpus;
  }

  @SuppressWarnings("unchecked")
  private static Function<VoiceGrammar, String>[] templates() {
    return new Function[] {
      (Function<VoiceGrammar, String>) g -> "delivery from " + g.grower() + " arrived at dock " + g.small(12),
      (Function<VoiceGrammar, String>) g -> g.qty() + " " + g.container() + " of " + g.produce() + " from " + g.grower() + " going to cold store " + g.small(6),
      (Function<VoiceGrammar, String>) g -> "move pallet " + g.small(40) + " from bay " + g.small(24) + " to bay " + g.small(24),
      (Function<VoiceGrammar, String>) g -> "truck " + g.small(20) + " is waiting at dock " + g.small(12),
      (Function<VoiceGrammar, String>) g -> "ripening room " + g.small(8) + " is at " + g.temp() + " degrees",
      (Function<VoiceGrammar, String>) g -> "docket " + g.docket() + " checked " + g.qty() + " " + g.container() + " short",
      (Function<VoiceGrammar, String>) g -> "put the " + g.ripening() + " in ripening room " + g.small(8) + " for " + g.small(6) + " days",
      (Function<VoiceGrammar, String>) g -> g.qty() + " " + g.container() + " of " + g.produce() + " rejected " + g.fault(),
      (Function<VoiceGrammar, String>) g -> "cold store " + g.small(6) + " door is open please close it",
      (Function<VoiceGrammar, String>) g -> "load " + g.qty() + " pallets of " + g.produce() + " onto truck " + g.small(20) + " for the " + g.clock() + " run",
      (Function<VoiceGrammar, String>) g -> "the " + g.grower() + " delivery is late by " + g.qty() + " minutes",
      (Function<VoiceGrammar, String>) g -> "bay " + g.small(24) + " is full move the " + g.produce() + " to bay " + g.small(24),
      (Function<VoiceGrammar, String>) g -> "count " + g.qty() + " " + g.container() + " of " + g.produce() + " in bay " + g.small(24),
      (Function<VoiceGrammar, String>) g -> "temperature in cold store " + g.small(6) + " is " + g.temp() + " degrees",
      (Function<VoiceGrammar, String>) g -> "lot " + g.lot() + " " + g.produce() + " " + g.qty() + " " + g.container() + " " + g.fault(),
      (Function<VoiceGrammar, String>) g -> "forklift " + g.small(9) + " needs charging at bay " + g.small(24),
      (Function<VoiceGrammar, String>) g -> "expecting " + g.qty() + " " + g.container() + " of " + g.produce() + " from " + g.grower() + " at " + g.clock() + " " + g.day(),
      (Function<VoiceGrammar, String>) g -> "order " + g.qty() + " is waiting at bay " + g.small(24),
      (Function<VoiceGrammar, String>) g -> "weigh the " + g.produce() + " from truck " + g.small(20) + " before unloading",
      (Function<VoiceGrammar, String>) g -> "net weight " + g.weight() + " kilos for docket " + g.docket(),
      (Function<VoiceGrammar, String>) g -> g.role() + " wants the " + g.produce() + " moved to cold store " + g.small(6),
      (Function<VoiceGrammar, String>) g -> "truck " + g.small(20) + " from " + g.grower() + " unloaded " + g.qty() + " " + g.container() + " of " + g.produce(),
      (Function<VoiceGrammar, String>) g -> "take the " + g.ripening() + " out of ripening room " + g.small(8) + " at " + g.clock(),
      (Function<VoiceGrammar, String>) g -> "pallet " + g.small(40) + " of " + g.produce() + " is " + g.fault() + " send it back to " + g.grower(),
      (Function<VoiceGrammar, String>) g -> "dock " + g.small(12) + " is free next truck in " + g.qty() + " minutes",
      (Function<VoiceGrammar, String>) g -> "we are short " + g.qty() + " " + g.container() + " of " + g.produce() + " on docket " + g.docket(),
      (Function<VoiceGrammar, String>) g -> "stack the " + g.container() + " of " + g.produce() + " " + g.small(6) + " high in bay " + g.small(24),
      (Function<VoiceGrammar, String>) g -> "cold store " + g.small(6) + " is at " + g.temp() + " degrees check the compressor",
      (Function<VoiceGrammar, String>) g -> "the " + g.produce() + " for " + g.grower() + " go out " + g.day() + " at " + g.clock(),
      (Function<VoiceGrammar, String>) g -> "relabel lot " + g.lot() + " as " + g.produce() + " not " + g.produce(),
    };
  }

  /** One sentence, sometimes with a conversational opener or closer. */
  String sentence() {
    int t = dice.below(TEMPLATES.length);
    while (corpus && isHeldOut(t)) t = dice.below(TEMPLATES.length);
    String body = TEMPLATES[t].apply(this);
    if (dice.chance(0.12)) body = dice.pick(OPENERS) + " " + body;
    if (dice.chance(0.10)) body = body + " " + dice.pick(CLOSERS);
    return body;
  }

  private static boolean isHeldOut(int template) {
    for (int h : HELD_OUT) if (h == template) return true;
    return false;
  }

  private String small(int max) {
    return NumberWords.cardinal(dice.between(1, max));
  }

  /** Quantities: mostly small, sometimes in the tens or over a hundred. */
  private String qty() {
    double u = dice.uniform();
    int n = u < 0.45 ? dice.between(1, 20) : u < 0.9 ? dice.between(21, 99) : dice.between(100, 250);
    return NumberWords.cardinal(n);
  }

  private String temp() {
    int whole = dice.between(1, 22);
    return dice.chance(0.3) ? NumberWords.cardinal(whole) + " point " + NumberWords.cardinal(dice.between(1, 9)) : NumberWords.cardinal(whole);
  }

  private String weight() {
    return NumberWords.cardinal(dice.between(180, 9800));
  }

  private String docket() {
    int n = dice.between(1000, 9999);
    return dice.chance(0.5) ? NumberWords.pairs(n) : NumberWords.digits(Integer.toString(n));
  }

  private String lot() {
    return NumberWords.digits(Integer.toString(dice.between(100, 999)));
  }

  private String clock() {
    int[] minutes = {0, 0, 15, 30, 45, 10, 20, 40, 50, 5};
    return NumberWords.time(dice.between(4, 11), minutes[dice.below(minutes.length)]);
  }

  private String grower() {
    return dice.pick(Lexicon.GROWER) + " " + dice.pick(Lexicon.GROWER_KIND);
  }

  private String produce() {
    return dice.pick(Lexicon.PRODUCE);
  }

  private String ripening() {
    return dice.pick(Lexicon.RIPENING);
  }

  private String container() {
    return dice.pick(Lexicon.CONTAINERS);
  }

  private String fault() {
    return dice.pick(Lexicon.FAULTS);
  }

  private String day() {
    return dice.chance(0.3) ? "tomorrow" : dice.chance(0.2) ? "today" : "on " + dice.pick(Lexicon.DAYS);
  }

  private String role() {
    return dice.pick(Lexicon.ROLES);
  }
}
