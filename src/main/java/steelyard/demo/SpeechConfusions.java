package steelyard.demo;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * The confusion table of the speech error simulator: for a word or a two-word phrase of the domain, the
 * similar-sounding outputs a general-purpose recogniser might produce, each with an acoustic similarity in
 * (0, 1] (1 = indistinguishable by sound). An alternative may be empty (the word is dropped), several words
 * (a split: {@code kiwifruit → kiwi fruit}) or one word for two (a merge: {@code cold store → coldstore}).
 *
 * <p>Table lines are {@code phrase = alt/sim, alt/sim}; {@code -} is the empty alternative. Held in a
 * {@link TreeMap} (lookups only; never iterated for generation).
 */
final class SpeechConfusions {
  /** One alternative output for a phrase. */
  record Alternative(List<String> words, double similarity) {}

  /** Words a recogniser inserts between words (hesitations and short function words), with similarity. */
  static final String[] FILLERS = {"uh", "um", "the", "a", "and"};

  private static final String TABLE = """
      bay = day/0.85, they/0.7, pay/0.75, bey/0.6
      bays = days/0.85, pays/0.7
      pallet = palate/0.95, pellet/0.8, palette/0.95, ballot/0.6
      pallets = palates/0.9, pellets/0.8, palettes/0.9, pallet/0.75
      crate = great/0.8, grate/0.9, crater/0.55
      dock = doc/0.9, dog/0.7, duck/0.65, doctor/0.45
      docket = pocket/0.75, locket/0.7, doc it/0.8, dock it/0.85
      truck = track/0.75, trek/0.6, struck/0.65, trucks/0.7
      cold store = coldstore/0.9, cold stall/0.65, goals store/0.5, cold storm/0.6
      store = story/0.7, stall/0.55, stole/0.6
      bin = been/0.8, pin/0.7, bean/0.7
      bins = beans/0.75, pins/0.7, been/0.6
      pears = pairs/0.95, peas/0.6, bears/0.6
      plums = plumbs/0.95, plum/0.7, plus/0.55
      leeks = leaks/0.95, leek/0.7
      limes = lines/0.75, lives/0.6, times/0.55
      lot = lots/0.7, a lot/0.7, lost/0.6, log/0.55
      ripening room = ripening rooms/0.7, ripe in room/0.65, ripping room/0.55, opening room/0.5
      celery = salary/0.8, celeriac/0.45
      carrots = carats/0.9, carrot/0.7, parrots/0.55
      lemons = lemmings/0.65, lemon/0.7
      onions = unions/0.75, onion/0.7
      mangoes = man goes/0.85, mango/0.7
      courgettes = core jets/0.6, courgette/0.75
      kiwifruit = kiwi fruit/0.95, kiwi/0.5
      beetroot = beet root/0.95, beat root/0.8
      strawberries = straw berries/0.85, strawberry/0.7
      blueberries = blue berries/0.85, blueberry/0.7
      cauliflower = cauli flower/0.6, colly flower/0.55
      kale = kail/0.9, cale/0.8, call/0.55
      peas = peace/0.9, pears/0.6, keys/0.5
      melons = lemons/0.55, melon/0.7
      cherries = sherries/0.75, berries/0.55, cherry/0.7
      cases = case/0.75, crates/0.6, bases/0.6
      crates = grates/0.9, cases/0.6, crate/0.7
      room = rooms/0.7, rim/0.5
      docks = dock/0.7
      forklift = fork lift/0.95, fork left/0.7
      relabel = re label/0.9, label/0.6
      unloaded = unload it/0.75, loaded/0.65, unloading/0.6
      unloading = unloaded/0.6, loading/0.7
      kilos = kilo/0.7, key lows/0.5, killers/0.5
      degrees = degree/0.75, agrees/0.55
      minutes = minute/0.75, minuets/0.6, mint is/0.45
      boxes = box is/0.8, box/0.6, boxers/0.6
      cartons = cartoons/0.75, carton/0.7
      trays = trees/0.65, tray/0.7, treys/0.7
      sacks = sax/0.9, sacs/0.95, socks/0.6
      rejected = ejected/0.7, reject it/0.8, rejecting/0.55
      checked = check/0.75, checks/0.6, chucked/0.55
      short = shot/0.75, sort/0.6, shorts/0.65
      waiting = weighting/0.95, wading/0.7, waiting for/0.5
      weigh = way/0.9, weight/0.7
      weight = wait/0.85, weighed/0.6
      net = neck/0.6, nett/0.95, met/0.6
      late = eight/0.6, lake/0.55, later/0.6
      soft = sought/0.65, sort/0.6
      bruised = brewed/0.55, browsed/0.6, bruise/0.75
      mouldy = moldy/0.95, mould he/0.5, moody/0.55
      frozen = frozen in/0.5, chosen/0.55
      charging = charting/0.6, charge in/0.7, changing/0.55
      compressor = compress or/0.7, compressors/0.7
      stack = stuck/0.7, snack/0.55, stacks/0.7
      degrees check = degree check/0.7
      moved = move/0.75, mood/0.55
      load = lode/0.9, low/0.55, loud/0.6
      run = ron/0.6, rum/0.55, runs/0.7
      four = for/0.9, fore/0.9, forty/0.6, fourteen/0.5
      two = to/0.95, too/0.95
      eight = a/0.6, ate/0.95, eighty/0.55, eighteen/0.5
      one = won/0.95, nine/0.55
      five = nine/0.6, fine/0.8, fife/0.7, fifty/0.5
      nine = five/0.6, night/0.55, ninety/0.5, nineteen/0.5
      six = sixty/0.6, sex/0.6, sixteen/0.5
      seven = eleven/0.55, seventy/0.6, seventeen/0.5
      eleven = seven/0.6
      three = free/0.75, tree/0.7
      ten = then/0.7, two/0.45
      fifteen = fifty/0.75
      fifty = fifteen/0.75, sixty/0.55
      fourteen = forty/0.75
      forty = fourteen/0.75, thirty/0.55, four/0.5
      sixteen = sixty/0.75
      sixty = sixteen/0.75, fifty/0.55
      seventeen = seventy/0.75
      seventy = seventeen/0.75, seven/0.5
      eighteen = eighty/0.75, eighteenth/0.55
      eighty = eighteen/0.75, a tea/0.45
      nineteen = ninety/0.75
      ninety = nineteen/0.75
      thirteen = thirty/0.75
      thirty = thirteen/0.75, dirty/0.55, forty/0.55
      twelve = twelfth/0.6, twenty/0.5
      twenty = twelve/0.5, plenty/0.55, seventy/0.5
      oh = o/0.9, -/0.55, owe/0.7
      point = pint/0.6, points/0.65
      hundred = hundreds/0.6
      the = a/0.7, -/0.7, that/0.55
      a = the/0.7, -/0.75, uh/0.6
      of = a/0.75, -/0.7, off/0.7
      to = the/0.6, -/0.7, two/0.95
      at = that/0.7, -/0.65, and/0.55
      is = his/0.7, -/0.7, as/0.65
      in = and/0.7, -/0.65, on/0.6
      for = four/0.9, -/0.6, from/0.5
      from = for/0.5, front/0.55
      and = in/0.7, -/0.6
      on = an/0.7, in/0.6
      it = -/0.6
      vellacott = vella cot/0.8, bella cot/0.6
      dunmarra = done mara/0.75, dun marra/0.8
      olwenby = olwen bee/0.75, old when be/0.55
      kestridge = kest ridge/0.8, chest ridge/0.6
      marrowby = marrow bee/0.8, marrow by/0.8
      thistleford = thistle ford/0.85, this will ford/0.5
      corrabin = cora bin/0.8, core a bin/0.6
      hallowmere = hallow mere/0.8, hollow mere/0.7
      ardlyn = ard lynn/0.7, hard lin/0.6
      pellingham = pelling ham/0.8, belling ham/0.6
      quillby = quill be/0.75, quill by/0.8
      tarnmoor = tarn moor/0.8, turn more/0.6
      brackenhurst = bracken hurst/0.85, bracken first/0.55
      fennimore = fenny more/0.8, finny more/0.6
      ottery = otter e/0.6, oddity/0.55
      wrenfield = wren field/0.85, ren field/0.8
      lowther = low there/0.65, lower/0.55
      caddow = cad oh/0.7, caddo/0.8
      sallowdene = sallow dean/0.8, shallow dean/0.6
      hobbarrow = hob barrow/0.85, hop barrow/0.65
      """;

  private static final Map<String, List<Alternative>> ENTRIES = parse(TABLE);

  private SpeechConfusions() {}

  /** Alternatives for a phrase of one or two words, or an empty list. */
  static List<Alternative> of(String phrase) {
    return ENTRIES.getOrDefault(phrase, List.of());
  }

  /** True for the invented grower names: words a general recogniser's vocabulary lacks. */
  static boolean isGrowerName(String word) {
    for (String g : Lexicon.GROWER) if (g.equals(word)) return true;
    return false;
  }

  private static Map<String, List<Alternative>> parse(String table) {
    Map<String, List<Alternative>> map = new TreeMap<>();
    for (String line : table.strip().split("\n")) {
      int eq = line.indexOf('=');
      String phrase = line.substring(0, eq).strip();
      List<Alternative> alts = new ArrayList<>();
      for (String part : line.substring(eq + 1).split(",")) {
        int slash = part.lastIndexOf('/');
        String words = part.substring(0, slash).strip();
        double sim = Double.parseDouble(part.substring(slash + 1).strip());
        if (sim <= 0) continue;
        alts.add(new Alternative(words.equals("-") ? List.of() : List.of(words.split(" ")), sim));
      }
      if (map.put(phrase, Collections.unmodifiableList(alts)) != null) throw new IllegalStateException("duplicate entry: " + phrase);
    }
    return map;
  }
}
