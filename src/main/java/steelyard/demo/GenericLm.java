package steelyard.demo;

import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * The simulated recogniser's own first-pass language model: a general-English model that does not know the
 * warehouse domain well. Natural-log probability, higher is better. Words fall in frequency tiers (function
 * words, general words, domain words, unknown words such as invented names); a short list of general-English
 * bigrams gets a bonus, and every other bigram a small fixed pseudo-random offset (from the strings' specified
 * {@code hashCode}) so that scores are not purely a sum of unigrams. Deterministic; no randomness.
 */
final class GenericLm {
  private static final double FUNCTION = -3.6;
  private static final double GENERAL = -6.6;
  private static final double NUMBER = -6.9;
  private static final double DOMAIN = -9.4;
  private static final double UNKNOWN = -12.8;
  private static final double SENTENCE_END = -2.3;

  private static final String FUNCTION_WORDS =
      "the a an of to at is in and for on from it are we be was that this by with not out as his off so yes up";
  private static final String GENERAL_WORDS = "day days they pay great grate been bean beans pin pins pairs peers bears track trek struck"
      + " dog doc doctor duck pocket locket story stall stole won want ate too fore owe o tea lower low there lake later eight"
      + " lines lives times lots lost log salary lemon parrots unions union man goes core jets fruit beet beat root straw blue"
      + " berries flower fork lift left label loaded loading key killers agrees minute mint box boxers cartoons trees"
      + " socks check checks shot sort shorts weighting wading way wait weighed neck met sought brewed browsed chosen"
      + " fine fife night sex sticks free tree then plenty bases rim berries charting charge changing compress stuck snack stacks move mood low loud ron rum runs pint points hundreds dirty"
      + " twelfth that front an done cot ridge chest ford will bin hard ham turn more field hurst first dean shallow hop"
      + " barrow mere hollow bee by quill otter oddity okay right alright note thanks please over cheers thank you"
      + " arrived going waiting put close open rejected late full free next send back take needs wants moved before"
      + " count door store cold room opening ripe ripping the want truck trucks lot short net weight load run point minutes"
      + " degrees boxes checked temperature today tomorrow monday tuesday wednesday thursday friday saturday sunday"
      + " high side wrong size wet crushed damaged frozen soft bruised delivery order not as relabel stack weigh unloaded"
      + " supervisor driver control quality night shift yard dispatch expecting apples oranges potatoes tomatoes bananas"
      + " lettuce carrots onions grapes peppers melons pumpkins strawberries cherries peaches lemons cabbages spinach"
      + " orchards growers farm fields gardens estate valley market garden cases pounds";
  private static final String NUMBER_WORDS = "zero one two three four five six seven eight nine ten eleven twelve thirteen"
      + " fourteen fifteen sixteen seventeen eighteen nineteen twenty thirty forty fifty sixty seventy eighty ninety"
      + " hundred thousand oh";
  private static final String DOMAIN_WORDS = "pallet pallets bay bays crate crates dock docket forklift kilos ripening"
      + " coldstore bins bin cartons trays sacks crate plums pears leeks limes celery kale peas mangoes courgettes"
      + " kiwifruit beetroot blueberries raspberries cauliflower broccoli avocados nectarines apricots mandarins"
      + " cucumbers palate palates pellet pellets palette palettes ballot grates greats crater plumbs leaks carats"
      + " lemmings sherries cherry cheery onion mango courgette kiwi celeriac colly cauli kail cale peace pees keys"
      + " unload unloading ejected reject rejecting chucked compressor compressors charging mouldy moldy moody"
      + " relabel nett sacs sax treys tray carton minuets mould over ripe under bey";
  private static final String BIGRAM_BONUS = "the day:3.0 a day:2.5 great day:3.5 next day:3.5 for the:2.0 of the:2.0"
      + " in the:2.0 to the:2.0 at the:1.5 is a:1.5 they are:2.5 we are:2.0 going to:3.0 been waiting:3.0 a great:2.0"
      + " the track:1.5 the story:1.5 kiwi fruit:5.5 fork lift:5.0 beet root:4.5 straw berries:3.5 blue berries:3.5"
      + " man goes:2.0 cold store:3.0 please close:2.0 close it:2.0 the dog:2.0 a lot:3.5 lots of:3.0 is late:2.0"
      + " waiting for:3.0 thank you:5.0 day five:-1.0 the door:2.5 cold stall:1.0 out of:3.0 send it:2.5 it back:2.5"
      + " is at:1.0 at dock:-0.5 the truck:2.0 the pallets:1.0 degree check:1.0 hollow mere:1.0 shallow dean:1.5";

  private static final Map<String, Double> UNIGRAMS = unigrams();
  private static final Map<String, Double> BIGRAMS = bigrams();

  private GenericLm() {}

  /** ln P(words, end of sentence) under the general model. */
  static double logProb(List<String> words) {
    double sum = 0;
    String previous = "<s>";
    for (String w : words) {
      sum += UNIGRAMS.getOrDefault(w, UNKNOWN) + bigramOffset(previous, w);
      previous = w;
    }
    return sum + SENTENCE_END + bigramOffset(previous, "</s>");
  }

  private static double bigramOffset(String previous, String word) {
    String key = previous + " " + word;
    Double bonus = BIGRAMS.get(key);
    if (bonus != null) return bonus;
    int h = key.hashCode() * 0x9E3779B1;
    return ((h >>> 8) / (double) (1 << 24) - 0.5) * 1.2;
  }

  private static Map<String, Double> unigrams() {
    Map<String, Double> map = new TreeMap<>();
    put(map, DOMAIN_WORDS, DOMAIN);
    put(map, GENERAL_WORDS, GENERAL);
    put(map, NUMBER_WORDS, NUMBER);
    put(map, FUNCTION_WORDS, FUNCTION);
    return map;
  }

  /** Later tiers overwrite earlier ones, so a word listed twice gets the more frequent tier. */
  private static void put(Map<String, Double> map, String words, double logProb) {
    for (String w : words.split(" ")) map.put(w, logProb);
  }

  private static Map<String, Double> bigrams() {
    Map<String, Double> map = new TreeMap<>();
    for (String entry : BIGRAM_BONUS.split(" (?=[^ :]+ [^ :]+:)")) {
      int colon = entry.lastIndexOf(':');
      map.put(entry.substring(0, colon), Double.parseDouble(entry.substring(colon + 1)));
    }
    return map;
  }
}
