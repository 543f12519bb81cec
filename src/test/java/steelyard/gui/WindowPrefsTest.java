package steelyard.gui;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import java.util.UUID;
import java.util.prefs.BackingStoreException;
import java.util.prefs.Preferences;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import steelyard.gui.model.OpenRequest;
import steelyard.io.FeatureSpec;
import steelyard.rescore.RescoreMethod;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

/** Recent file sets and layout in a preferences node of the test's own (removed afterwards). */
class WindowPrefsTest {
  private Preferences node;
  private WindowPrefs prefs;

  @BeforeEach
  void node() {
    node = Preferences.userRoot().node("steelyard-test/" + UUID.randomUUID());
    prefs = new WindowPrefs(node);
  }

  @AfterEach
  void remove() throws BackingStoreException {
    node.removeNode();
  }

  private static OpenRequest request(String name) {
    return OpenRequest.of(Path.of("/data", name + ".nbest.csv"), Path.of("/data", name + ".refs.csv"), Path.of("/m/lm.arpa.gz"), null,
        FeatureSpec.parseList("acoustic,conf:linear:scale=0.01"), Unit.CHAR,
        new NormalisationOptions(true, false, true, false, Path.of("/data/x.rules")), RescoreMethod.LATTICE);
  }

  @Test
  void aRecentFileSetComesBackWithEveryOption() {
    prefs.addRecent(request("a"));
    assertThat(new WindowPrefs(node).recent()).containsExactly(request("a"));
  }

  @Test
  void theNewestIsFirstAndAnEqualOlderEntryIsNotRepeated() {
    prefs.addRecent(request("a"));
    prefs.addRecent(request("b"));
    prefs.addRecent(request("a"));
    assertThat(prefs.recent()).extracting(r -> r.hyps().getFileName().toString()).containsExactly("a.nbest.csv", "b.nbest.csv");
  }

  @Test
  void onlyTheNewestEightAreKept() {
    for (int k = 0; k < 11; k++) prefs.addRecent(request("f" + k));
    assertThat(prefs.recent()).hasSize(WindowPrefs.MAX_RECENT).first().extracting(r -> r.hyps().getFileName().toString())
        .isEqualTo("f10.nbest.csv");
  }

  @Test
  void boundsAndLayoutValuesPersist() {
    prefs.bounds(new WindowPrefs.Bounds(10, 20, 1300, 800));
    prefs.putLayout("split.left", 333);
    prefs.flush();
    WindowPrefs again = new WindowPrefs(node);
    assertThat(again.bounds()).isEqualTo(new WindowPrefs.Bounds(10, 20, 1300, 800));
    assertThat(again.layout("split.left", -1)).isEqualTo(333);
    assertThat(again.layout("split.right", -1)).isEqualTo(-1);
  }

  @Test
  void aDamagedEntryIsSkipped() {
    node.put("recent.0", "not an entry");
    assertThat(prefs.recent()).isEmpty();
  }
}
