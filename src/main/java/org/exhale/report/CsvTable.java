package org.exhale.report;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.exhale.io.ErrorKind;
import org.exhale.io.InputException;

/**
 * A comma-separated table as the exhale commands write it: one header line, then rows of the
 * same width. Cells stay text until a chart asks for a number, so tables with columns the report
 * does not know are read all the same. Quoted cells ({@code "a,b"}, {@code ""} for a quote) are
 * understood.
 */
public final class CsvTable {
    /** Larger tables are refused: the report reads output folders, not arbitrary data. */
    static final long MAX_BYTES = 256L << 20;

    private final String file;
    private final List<String> header;
    private final Map<String, Integer> index = new LinkedHashMap<>();
    private final List<String[]> rows;
    private final List<Integer> lines;

    private CsvTable(String file, List<String> header, List<String[]> rows, List<Integer> lines) {
        this.file = file;
        this.header = List.copyOf(header);
        for (int i = 0; i < header.size(); i++) {
            index.putIfAbsent(header.get(i), i);
        }
        this.rows = rows;
        this.lines = lines;
    }

    public static CsvTable read(Path path) {
        String text;
        try {
            if (Files.size(path) > MAX_BYTES) {
                throw new InputException(ErrorKind.TOO_LARGE, path.toString(), "", 0,
                        "larger than " + (MAX_BYTES >> 20) + " MiB; expected an exhale output table");
            }
            text = Files.readString(path, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new InputException(ErrorKind.FILE_UNREADABLE, path.toString(), "", 0,
                    "cannot read (" + org.exhale.io.Messages.of(e) + ")", e);
        }
        return parse(path.toString(), text);
    }

    static CsvTable parse(String file, String text) {
        List<String> header = null;
        List<String[]> rows = new ArrayList<>();
        List<Integer> lines = new ArrayList<>();
        int lineNo = 0;
        for (String line : text.split("\r?\n", -1)) {
            lineNo++;
            if (line.isBlank() || line.startsWith("#")) {
                continue;
            }
            List<String> cells = split(file, line, lineNo);
            if (header == null) {
                header = new ArrayList<>();
                for (String c : cells) {
                    header.add(c.strip());
                }
                continue;
            }
            if (cells.size() != header.size()) {
                throw new InputException(ErrorKind.SYNTAX, file, "row " + (rows.size() + 1), lineNo,
                        cells.size() + " cells; expected " + header.size() + " as in the header");
            }
            rows.add(cells.toArray(new String[0]));
            lines.add(lineNo);
        }
        if (header == null) {
            throw new InputException(ErrorKind.EMPTY_FILE, file, "", 0, "no header line; expected a CSV table");
        }
        return new CsvTable(file, header, rows, lines);
    }

    private static List<String> split(String file, String line, int lineNo) {
        List<String> out = new ArrayList<>();
        StringBuilder cell = new StringBuilder();
        boolean quoted = false;
        for (int i = 0; i < line.length(); i++) {
            char ch = line.charAt(i);
            if (quoted) {
                if (ch == '"' && i + 1 < line.length() && line.charAt(i + 1) == '"') {
                    cell.append('"');
                    i++;
                } else if (ch == '"') {
                    quoted = false;
                } else {
                    cell.append(ch);
                }
            } else if (ch == '"') {
                quoted = true;
            } else if (ch == ',') {
                out.add(cell.toString());
                cell.setLength(0);
            } else {
                cell.append(ch);
            }
        }
        if (quoted) {
            throw new InputException(ErrorKind.SYNTAX, file, "", lineNo, "unterminated quote");
        }
        out.add(cell.toString());
        return out;
    }

    public String file() {
        return file;
    }

    public List<String> header() {
        return header;
    }

    public int size() {
        return rows.size();
    }

    public boolean has(String column) {
        return index.containsKey(column);
    }

    /** The columns whose name starts with the prefix and ends with the suffix, in file order. */
    public List<String> columns(String prefix, String suffix) {
        List<String> out = new ArrayList<>();
        for (String h : header) {
            if (h.startsWith(prefix) && h.endsWith(suffix) && h.length() > prefix.length() + suffix.length()) {
                out.add(h);
            }
        }
        return out;
    }

    public String text(int row, String column) {
        return rows.get(row)[col(column)].strip();
    }

    /** The cell as a number; an empty cell is NaN (the writers leave non-finite values empty). */
    public double number(int row, String column) {
        String s = text(row, column);
        if (s.isEmpty()) {
            return Double.NaN;
        }
        try {
            double v = Double.parseDouble(s);
            if (!Double.isFinite(v)) {
                // exhale writes no inf or NaN (a value not loaded is an empty cell): such a cell was edited or is not ours
                throw new InputException(ErrorKind.BAD_NUMBER, file, "row " + (row + 1) + ", column '" + column + "'",
                        lines.get(row), "'" + s + "' is not a finite number; expected a finite number or an empty cell");
            }
            return v;
        } catch (NumberFormatException e) {
            throw new InputException(ErrorKind.BAD_NUMBER, file, "row " + (row + 1) + ", column '" + column + "'",
                    lines.get(row), "'" + s + "' is not a number");
        }
    }

    /** Distinct values of a text column in order of first appearance. */
    public List<String> distinct(String column) {
        if (!has(column)) {
            return Collections.emptyList();
        }
        List<String> out = new ArrayList<>();
        for (int r = 0; r < rows.size(); r++) {
            String v = text(r, column);
            if (!out.contains(v)) {
                out.add(v);
            }
        }
        return out;
    }

    private int col(String column) {
        Integer i = index.get(column);
        if (i == null) {
            throw new InputException(ErrorKind.MISSING_KEY, file, "header", 1,
                    "no column '" + column + "'; found " + String.join(", ", header));
        }
        return i;
    }
}
