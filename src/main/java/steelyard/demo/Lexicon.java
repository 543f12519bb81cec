package steelyard.demo;

/**
 * The invented world of the demo data: the Tallowmere Produce Cooperative, its growers (all names invented),
 * its produce, containers and places in the warehouse. Arrays, never hash-ordered collections, so that draws
 * from them are reproducible.
 */
final class Lexicon {
  private Lexicon() {}

  static final String COOPERATIVE = "Tallowmere Produce Cooperative";

  /** Produce as spoken (plural or mass noun, lowercase). */
  static final String[] PRODUCE = {
    "apples", "pears", "plums", "cherries", "lemons", "limes", "oranges", "mandarins", "peaches", "nectarines",
    "apricots", "bananas", "avocados", "mangoes", "tomatoes", "cucumbers", "lettuce", "cabbages", "cauliflower",
    "broccoli", "carrots", "onions", "potatoes", "leeks", "celery", "spinach", "kale", "courgettes", "peppers",
    "strawberries", "blueberries", "raspberries", "grapes", "kiwifruit", "melons", "pumpkins", "beetroot", "peas"
  };

  /** Produce that goes to the ripening rooms. */
  static final String[] RIPENING = {"bananas", "avocados", "mangoes", "tomatoes", "pears", "peaches", "kiwifruit", "apricots"};

  /** Varieties as printed on dockets, paired loosely with produce. */
  static final String[] VARIETY = {"Gala", "Braeburn", "Comice", "Conference", "Victoria", "Hass", "Roma", "Cos", "Iceberg", "Navel"};

  /** First part of an invented grower name. */
  static final String[] GROWER = {
    "vellacott", "dunmarra", "olwenby", "kestridge", "marrowby", "thistleford", "corrabin", "hallowmere",
    "ardlyn", "pellingham", "quillby", "tarnmoor", "brackenhurst", "fennimore", "ottery", "wrenfield",
    "lowther", "caddow", "sallowdene", "hobbarrow"
  };

  /** Second part of a grower name. */
  static final String[] GROWER_KIND = {"orchards", "growers", "farm", "fields", "gardens", "estate", "valley growers", "market garden"};

  /** Containers as spoken (plural). */
  static final String[] CONTAINERS = {"pallets", "crates", "cases", "bins", "boxes", "trays", "sacks", "cartons"};

  /** Problems reported on a delivery. */
  static final String[] FAULTS = {
    "too soft", "bruised", "over ripe", "under ripe", "wet", "mouldy", "frozen", "crushed", "damaged", "the wrong size"
  };

  /** Weekdays, spoken and printed in lowercase then capitalised as needed. */
  static final String[] DAYS = {"monday", "tuesday", "wednesday", "thursday", "friday", "saturday", "sunday"};

  /** Short labels of warehouse staff roles used in the voice logs. */
  static final String[] ROLES = {"the driver", "the supervisor", "quality control", "the night shift", "the yard", "dispatch"};

  /** Docket short forms of container names. */
  static final String[] DOCKET_CONTAINERS = {"pallets", "cases", "bins", "crates", "ctns", "trays", "sacks"};

  /** Docket line openers naming a field. */
  static final String[] DOCKET_FIELDS = {"Docket No:", "Docket", "Dkt", "DOCKET #"};

  static String capitalise(String word) {
    return word.isEmpty() ? word : Character.toUpperCase(word.charAt(0)) + word.substring(1);
  }

  /** Each space-separated word capitalised: {@code "valley growers" → "Valley Growers"}. */
  static String title(String words) {
    StringBuilder sb = new StringBuilder(words.length());
    boolean start = true;
    for (int i = 0; i < words.length(); i++) {
      char c = words.charAt(i);
      sb.append(start ? Character.toUpperCase(c) : c);
      start = c == ' ';
    }
    return sb.toString();
  }
}
