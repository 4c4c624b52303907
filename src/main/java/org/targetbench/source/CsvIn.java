package org.targetbench.source;

import java.util.ArrayList;
import java.util.List;

/** Splitting of one CSV line (RFC 4180 quoting: a quoted cell may hold commas and doubled quotes). */
public final class CsvIn {
    private CsvIn() {}

    /** The cells of one line; throws IllegalArgumentException on an unterminated quote. */
    public static List<String> split(String line) {
        List<String> cells = new ArrayList<>();
        StringBuilder b = new StringBuilder();
        boolean quoted = false;
        for (int i = 0; i < line.length(); i++) {
            char ch = line.charAt(i);
            if (quoted) {
                if (ch == '"') {
                    if (i + 1 < line.length() && line.charAt(i + 1) == '"') {
                        b.append('"');
                        i++;
                    } else quoted = false;
                } else b.append(ch);
            } else if (ch == '"') {
                quoted = true;
            } else if (ch == ',') {
                cells.add(b.toString());
                b.setLength(0);
            } else b.append(ch);
        }
        if (quoted) throw new IllegalArgumentException("unterminated quote");
        cells.add(b.toString());
        return cells;
    }
}
