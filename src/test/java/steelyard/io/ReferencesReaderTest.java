package steelyard.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ReferencesReaderTest {
  @TempDir Path dir;

  @Test
  void readsIdsTextsGroupsAndLinesInFileOrder() {
    Path f = Csv.write(dir, "r.csv", "\uFEFFgroup,utt_id,notes,text\r\nbay4,u2,x,\"two, crates\"\r\nbay1,u1,y,\r\n");
    var refs = ReferencesReader.readAll(f, ImportOptions.strict(List.of()));
    assertThat(refs.keySet()).containsExactly("u2", "u1");
    assertThat(refs.get("u2")).isEqualTo(new Reference("u2", "two, crates", "bay4", 2));
    assertThat(refs.get("u1")).isEqualTo(new Reference("u1", "", "bay1", 3));
  }

  @Test
  void groupIsEmptyWhenAbsentAndGzipIsAccepted() {
    Path f = Csv.write(dir, "r.csv.gz", "utt_id,text\nu1,pallets\n");
    assertThat(ReferencesReader.readAll(f, ImportOptions.strict(List.of())).get("u1").group()).isEmpty();
  }

  @Test
  void headerOnlyGivesNoReferences() {
    assertThat(ReferencesReader.readAll(Csv.write(dir, "r.csv", "utt_id,text\n"), ImportOptions.strict(List.of()))).isEmpty();
  }

  @Test
  void duplicateIdNamesBothLines() {
    Path f = Csv.write(dir, "r.csv", "utt_id,text\nu1,a\nu1,b\n");
    assertThatThrownBy(() -> ReferencesReader.readAll(f, ImportOptions.strict(List.of())))
        .isInstanceOf(InputException.class)
        .hasMessage(f + ":3: utt_id 'u1' appears twice: first at line 2, again at line 3; expected one reference per utterance");
  }

  @Test
  void missingFileIsAnInputErrorNamingIt() {
    Path f = dir.resolve("nope.csv");
    assertThatThrownBy(() -> ReferencesReader.readAll(f, ImportOptions.strict(List.of())))
        .isInstanceOf(InputException.class)
        .hasMessage(f + ": no such file; expected an existing file");
  }
}
