package steelyard.text;

import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import java.util.ArrayList;
import java.util.List;

/**
 * A growing string ↔ dense int id map shared by everything that holds tokens as ids.
 *
 * <p>Storage: an {@link Object2IntOpenHashMap} from token to id plus an {@link ArrayList} from id to token;
 * roughly 40 bytes per distinct token on top of the strings themselves. Ids start at 0 and are assigned in
 * first-seen order, so the same input order gives the same ids. Not thread-safe: callers that intern from
 * several threads synchronise, or intern up front.
 */
public final class Vocabulary {
  /** Returned by {@link #idOf(String)} for a token that was never interned. */
  public static final int ABSENT = -1;

  private final Object2IntOpenHashMap<String> ids = new Object2IntOpenHashMap<>();
  private final List<String> tokens = new ArrayList<>();

  public Vocabulary() {
    ids.defaultReturnValue(ABSENT);
  }

  /** The id of {@code token}, assigning the next id when it is new. */
  public int intern(String token) {
    int id = ids.getInt(token);
    if (id != ABSENT) return id;
    id = tokens.size();
    ids.put(token, id);
    tokens.add(token);
    return id;
  }

  /** Interns each token in order. */
  public int[] internAll(List<String> tokenList) {
    int[] out = new int[tokenList.size()];
    for (int i = 0; i < out.length; i++) out[i] = intern(tokenList.get(i));
    return out;
  }

  /** The id of {@code token}, or {@link #ABSENT}. */
  public int idOf(String token) {
    return ids.getInt(token);
  }

  /** The token with id {@code id}. */
  public String token(int id) {
    return tokens.get(id);
  }

  public int size() {
    return tokens.size();
  }
}
