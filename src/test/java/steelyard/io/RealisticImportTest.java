package steelyard.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Imports the realistic recogniser output of the shared fixture folder (its README describes the files). */
class RealisticImportTest {

  static Path realistic() {
    for (String candidate : new String[] {"../shared/realistic", "../../shared/realistic", "/work/shared/realistic"}) {
      Path p = Path.of(candidate);
      if (Files.isDirectory(p)) return p;
    }
    return null;
  }

  private static Path fixture(String relative) {
    Path dir = realistic();
    assumeTrue(dir != null, "realistic fixture folder (../shared/realistic) is absent; skipping");
    Path p = dir.resolve(relative);
    assumeTrue(Files.isRegularFile(p), p + " is absent; skipping");
    return p;
  }

  private static List<UtteranceHypotheses> readAll(Path file, String features, List<String> warnings) {
    ImportOptions options = new ImportOptions(FeatureSpec.parseList(features), null, 0, warnings::add, s -> {});
    List<UtteranceHypotheses> out = new ArrayList<>();
    try (HypothesesReader r = HypothesesReader.open(file, options)) {
      while (r.hasNext()) out.add(r.next());
    }
    return out;
  }

  @Test
  void importsAsrTwentyBestListsOfEightyUtterances() {
    List<String> warnings = new ArrayList<>();
    List<UtteranceHypotheses> utts = readAll(fixture("asr/dev.nbest.csv"), "acoustic,lm", warnings);
    // The fixture README states 80 utterances × 20 distinct hypotheses.
    assertThat(utts).hasSize(80);
    assertThat(utts).allSatisfy(u -> assertThat(u.size()).isEqualTo(20));
    assertThat(utts).allSatisfy(u -> assertThat(u.first().rank()).isEqualTo(1));
    assertThat(utts.get(0).hypotheses().get(0).features()).hasSize(2).containsExactly(-1160.0316, -60.3928);
    assertThat(warnings).isEmpty();
    LinkedHashMap<String, Reference> refs =
        ReferencesReader.readAll(fixture("asr/dev.refs.csv"), ImportOptions.strict(List.of()));
    assertThat(refs).hasSize(80);
    assertThat(refs.keySet()).containsExactlyElementsOf(utts.stream().map(UtteranceHypotheses::uttId).toList());
  }

  @Test
  void importsOcrConfigurationsWithCrlfAndEmptyHypotheses() throws Exception {
    Path file = fixture("ocr/dev.nbest.csv");
    List<UtteranceHypotheses> utts = readAll(file, "confidence", new ArrayList<>());
    // The fixture README states 100 lines × 6 configurations, CRLF line ends, possible empty hypotheses.
    assertThat(utts).hasSize(100);
    assertThat(utts).allSatisfy(u -> assertThat(u.size()).isEqualTo(6));
    List<Hypothesis> all = utts.stream().flatMap(u -> u.hypotheses().stream()).toList();
    assertThat(all).noneMatch(h -> h.text().contains("\r") || h.system().contains("\r"));
    long emptyInFile = Files.readAllLines(file).stream().skip(1).filter(l -> l.matches("[^,]*,[^,]*,[^,]*,,.*")).count();
    assertThat(all.stream().filter(h -> h.text().isEmpty()).count()).isEqualTo(emptyInFile);
    assertThat(all).allSatisfy(h -> assertThat(h.features()[0]).isBetween(-10.0, 0.0));
    LinkedHashMap<String, Reference> refs =
        ReferencesReader.readAll(fixture("ocr/dev.refs.csv"), ImportOptions.strict(List.of()));
    assertThat(refs).hasSize(100);
    assertThat(refs.values()).noneMatch(r -> r.text().endsWith("\r"));
  }
}
