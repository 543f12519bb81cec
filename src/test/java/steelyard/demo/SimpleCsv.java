package steelyard.demo;

import com.opencsv.CSVReader;
import com.opencsv.exceptions.CsvException;
import java.io.IOException;
import java.io.InputStreamReader;
import java.io.ByteArrayInputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** Test-scope reading of generated CSV with a general-purpose RFC 4180 reader (opencsv). */
final class SimpleCsv {
  private SimpleCsv() {}

  /** Rows as column-name → value maps, in file order. */
  static List<Map<String, String>> rows(byte[] file) {
    try (CSVReader reader = new CSVReader(new InputStreamReader(new ByteArrayInputStream(file), StandardCharsets.UTF_8))) {
      List<String[]> all = reader.readAll();
      String[] header = all.get(0);
      List<Map<String, String>> rows = new ArrayList<>();
      for (int i = 1; i < all.size(); i++) {
        String[] r = all.get(i);
        if (r.length != header.length) throw new IllegalStateException("row " + (i + 1) + " has " + r.length + " fields");
        Map<String, String> m = new LinkedHashMap<>();
        for (int c = 0; c < header.length; c++) m.put(header[c], r[c]);
        rows.add(m);
      }
      return rows;
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    } catch (CsvException e) {
      throw new IllegalStateException(e);
    }
  }

  static List<String> header(byte[] file) {
    String text = new String(file, StandardCharsets.UTF_8);
    return List.of(text.substring(0, text.indexOf('\n')).split(","));
  }
}
