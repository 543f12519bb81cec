package steelyard.gui.model;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import steelyard.io.FeatureSpec;
import steelyard.io.HypothesesReader;
import steelyard.io.ImportOptions;
import steelyard.io.InputException;

/** The import dialog's preview flags exactly the rows the strict import rejects, with its messages. */
class ImportPreviewTest {
  @TempDir Path dir;

  @Test
  void aBadRowCarriesTheStrictImportsMessage() throws IOException {
    Path f = dir.resolve("h.csv");
    Files.writeString(f, "utt_id,rank,text,acoustic\nu1,1,ten crates,-3\nu1,2,ten,oops\nu2,1,bay nine,-4\n");
    ImportPreview p = ImportPreview.of(f, FeatureSpec.parseList("acoustic"), 40);
    String strict = strictMessage(f);
    assertThat(p.lines()).extracting(ImportPreview.Line::number, ImportPreview.Line::problem)
        .containsExactly(org.assertj.core.groups.Tuple.tuple(1L, null), org.assertj.core.groups.Tuple.tuple(2L, null),
            org.assertj.core.groups.Tuple.tuple(3L, strict), org.assertj.core.groups.Tuple.tuple(4L, null));
    assertThat(p.header()).containsExactly("utt_id", "rank", "text", "acoustic");
    assertThat(p.scoreColumns()).containsExactly("acoustic");
    assertThat(p.fatal()).isNull();
  }

  @Test
  void aBadHeaderIsFatal() throws IOException {
    Path f = dir.resolve("h.csv");
    Files.writeString(f, "id,words\nu1,ten\n");
    ImportPreview p = ImportPreview.of(f, FeatureSpec.parseList(""), 40);
    assertThat(p.fatal()).isEqualTo(strictMessage(f));
    assertThat(p.lines()).hasSize(2);
  }

  @Test
  void onlyTheFirstLinesAreShown() throws IOException {
    Path f = dir.resolve("h.csv");
    StringBuilder sb = new StringBuilder("utt_id,text\n");
    for (int k = 0; k < 100; k++) sb.append("u").append(k).append(",word\n");
    Files.writeString(f, sb);
    assertThat(ImportPreview.of(f, FeatureSpec.parseList(""), 10).lines()).hasSize(10);
  }

  private static String strictMessage(Path f) {
    try (HypothesesReader r = HypothesesReader.open(f, ImportOptions.strict(FeatureSpec.parseList("acoustic")))) {
      while (r.hasNext()) r.next();
    } catch (InputException e) {
      return e.getMessage();
    }
    throw new AssertionError("the strict import accepted " + f);
  }
}
