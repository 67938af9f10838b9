package org.voteworth.source;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class RowParserTest {
    private static final DumpFile GARDEN = new DumpFile(Path.of("garden.part-01.tsv"), "garden", DumpFile.Compression.NONE, 0);
    private static final DumpFile TOYS = new DumpFile(Path.of("toys.tsv"), "toys", DumpFile.Compression.NONE, 0);

    private final ReviewRow row = new ReviewRow();

    private Reject parse(RowParser p, String line) {
        return parse(p, line.getBytes(StandardCharsets.UTF_8));
    }

    private Reject parse(RowParser p, byte[] line) {
        // Surround the line with other bytes: the parser must keep to [start, end).
        byte[] b = new byte[line.length + 6];
        b[0] = 'x';
        b[1] = '\t';
        b[2] = '\n';
        System.arraycopy(line, 0, b, 3, line.length);
        b[line.length + 3] = '\n';
        b[line.length + 4] = '9';
        b[line.length + 5] = '\t';
        row.file = GARDEN;
        return p.parse(b, 3, 3 + line.length, row);
    }

    private static RowParser tsv() {
        return new RowParser(SampleDump.mapping(), Format.TSV);
    }

    @Test
    void fillsEveryMappedFieldOfAValidRow() {
        Reject r = parse(tsv(), SampleDump.row("R1001", 3, 5));
        assertThat(r.isNone()).isTrue();
        assertThat(r).isSameAs(Reject.NONE);
        assertThat(row.reviewer()).isEqualTo("R1001");
        assertThat(row.review()).isEqualTo("VR10013");
        assertThat(row.item()).isEqualTo("ITEM-7");
        assertThat(row.category()).isEqualTo("garden");
        assertThat(row.stars).isEqualTo(4);
        assertThat(row.helpful).isEqualTo(3);
        assertThat(row.total).isEqualTo(5);
        assertThat(row.verified).isEqualTo(1);
        assertThat(row.incentivised).isEqualTo(0);
        // The JDK is the reference for the epoch day.
        assertThat(row.epochDay).isEqualTo((int) LocalDate.of(2021, 3, 14).toEpochDay());
    }

    @Test
    void quotesAreOrdinaryDataInTsv() {
        Reject r = parse(tsv(), SampleDump.rowWith(0, "\"R\"1").replace("Sturdy \"rake\"", "an \"unclosed quote"));
        assertThat(r.isNone()).isTrue();
        assertThat(row.reviewer()).isEqualTo("\"R\"1");
    }

    @Test
    void unmappedColumnsAreSkippedWhateverTheyHold() {
        byte[] odd = {(byte) 0xFF, (byte) 0xFE, 0, '"', ',', ';', (byte) 0xC3};
        String line = SampleDump.row("R2", 0, 0);
        byte[] b = (line.substring(0, line.lastIndexOf('\t') + 1)).getBytes(StandardCharsets.UTF_8);
        byte[] all = new byte[b.length + odd.length];
        System.arraycopy(b, 0, all, 0, b.length);
        System.arraycopy(odd, 0, all, b.length, odd.length);
        assertThat(parse(tsv(), all).isNone()).isTrue();
        assertThat(row.total).isZero();
    }

    @ParameterizedTest(name = "{0} {1} -> {2}")
    @CsvSource(delimiter = '|', quoteCharacter = '\'', value = {
        // column | value            | reason               | field        | reported value
        "0  | ''                     | empty-reviewer       | reviewer     | ''",
        "0  | '   '                  | empty-reviewer       | reviewer     | '   '",
        "5  | abc                    | bad-votes            | helpful      | abc",
        "5  | 1.5                    | bad-votes            | helpful      | 1.5",
        "5  | -3                     | bad-votes            | helpful      | -3",
        "5  | +3                     | bad-votes            | helpful      | +3",
        "5  | ''                     | bad-votes            | helpful      | ''",
        "5  | 1 000                  | bad-votes            | helpful      | 1 000",
        "5  | 9223372036854775808    | bad-votes            | helpful      | 9223372036854775808",
        "6  | x                      | bad-votes            | total        | x",
        "6  | 99999999999999999999   | bad-votes            | total        | 99999999999999999999",
        "6  | 0                      | helpful-above-total  | helpful      | 1",
        "4  | 0                      | bad-stars            | stars        | 0",
        "4  | 6                      | bad-stars            | stars        | 6",
        "4  | 4.5                    | bad-stars            | stars        | 4.5",
        "4  | 4.                     | bad-stars            | stars        | 4.",
        "4  | five                   | bad-stars            | stars        | five",
        "7  | maybe                  | bad-flag             | verified     | maybe",
        "7  | 2                      | bad-flag             | verified     | 2",
        "8  | yess                   | bad-flag             | incentivised | yess",
        "9  | 2021-02-30             | bad-date             | date         | 2021-02-30",
        "9  | 2021-13-01             | bad-date             | date         | 2021-13-01",
        "9  | 2021-00-10             | bad-date             | date         | 2021-00-10",
        "9  | 1900-02-29             | bad-date             | date         | 1900-02-29",
        "9  | yesterday              | bad-date             | date         | yesterday",
        "9  | 2021-2-3               | bad-date             | date         | 2021-2-3",
        "9  | 14/03/2021             | bad-date             | date         | 14/03/2021",
        "9  | 2021-03-14Z            | bad-date             | date         | 2021-03-14Z",
    })
    void rejectsEachBadFieldWithReasonFieldAndValue(int column, String value, String reason, String field, String shown) {
        Reject r = parse(tsv(), SampleDump.rowWith(column, value));
        assertThat(r.reason()).isEqualTo(reason);
        assertThat(r.field()).isEqualTo(field);
        assertThat(r.value()).isEqualTo(shown);
        assertThat(r.message()).isNotBlank();
    }

    @Test
    void messagesSayWhatWasWrong() {
        assertThat(parse(tsv(), SampleDump.rowWith(5, "abc")).message())
                .isEqualTo("helpful votes 'abc' is not a non-negative whole number");
        assertThat(parse(tsv(), SampleDump.rowWith(5, "")).message()).isEqualTo("helpful votes is empty");
        assertThat(parse(tsv(), SampleDump.rowWith(6, "99999999999999999999")).message()).contains("too large");
        assertThat(parse(tsv(), SampleDump.rowWith(6, "0")).message()).isEqualTo("helpful votes 1 exceed total votes 0");
        assertThat(parse(tsv(), SampleDump.rowWith(9, "2021-02-30")).message())
                .isEqualTo("date '2021-02-30' is not a real calendar date written yyyy-MM-dd");
    }

    @Test
    void wrongFieldCountIsARowReject() {
        String twelve = SampleDump.row("R1", 1, 2);
        Reject fewer = parse(tsv(), twelve.substring(0, twelve.lastIndexOf('\t')));
        assertThat(fewer.reason()).isEqualTo(Reject.FIELD_COUNT);
        assertThat(fewer.field()).isEqualTo(Reject.ROW);
        assertThat(fewer.message()).isEqualTo("expected 12 fields, found 11");
        // A tab inside the review text makes one field too many.
        Reject more = parse(tsv(), twelve + "\tmore text after a tab");
        assertThat(more.message()).isEqualTo("expected 12 fields, found 13");
        assertThat(more.value()).isEqualTo("13");
        assertThat(parse(tsv(), "R1,1,2").message()).isEqualTo("expected 12 fields, found 1");
    }

    @Test
    void blankLinesAreEmptyRows() {
        for (String blank : new String[] {"", "   ", "\r", "\t\t", " \t \r"}) {
            Reject r = parse(tsv(), blank);
            assertThat(r.reason()).as("'%s'", blank).isEqualTo(Reject.EMPTY_ROW);
            assertThat(r.field()).isEqualTo(Reject.ROW);
        }
    }

    @Test
    void emptyOptionalFieldsAreAbsent() {
        String line = SampleDump.rowWith(4, "");
        line = String.join("\t", replace(line.split("\t", -1), Map.of(7, "", 8, " ", 9, "")));
        assertThat(parse(tsv(), line)).isSameAs(Reject.NONE);
        assertThat(row.stars).isEqualTo(ReviewRow.ABSENT);
        assertThat(row.verified).isEqualTo(ReviewRow.ABSENT);
        assertThat(row.incentivised).isEqualTo(ReviewRow.ABSENT);
        assertThat(row.epochDay).isEqualTo(ReviewRow.NO_DATE);
    }

    @Test
    void unmappedOptionalFieldsAreAbsent() {
        RowParser p = new RowParser(ColumnMapping.of(3, Map.of(Field.REVIEWER, 0, Field.HELPFUL, 1, Field.TOTAL, 2)), Format.TSV);
        assertThat(parse(p, "R9\t0\t1").isNone()).isTrue();
        assertThat(row.stars).isEqualTo(ReviewRow.ABSENT);
        assertThat(row.verified).isEqualTo(ReviewRow.ABSENT);
        assertThat(row.epochDay).isEqualTo(ReviewRow.NO_DATE);
        assertThat(row.review()).isEmpty();
        assertThat(row.item()).isEmpty();
        assertThat(row.category()).isEqualTo("garden");
    }

    @Test
    void parserNeedsTheRequiredFields() {
        assertThatThrownBy(() -> new RowParser(ColumnMapping.of(2, Map.of(Field.REVIEWER, 0, Field.HELPFUL, 1)), Format.TSV))
                .hasMessageContaining("total");
    }

    @Test
    void spacesAroundNumbersFlagsAndDatesAreIgnored() {
        String line = String.join("\t", replace(SampleDump.row("R1", 1, 2).split("\t", -1),
                Map.of(4, " 5 ", 5, " 2", 6, "3 ", 7, " yes ", 9, " 2020-02-29 ")));
        assertThat(parse(tsv(), line).isNone()).isTrue();
        assertThat(row.stars).isEqualTo(5);
        assertThat(row.helpful).isEqualTo(2);
        assertThat(row.total).isEqualTo(3);
        assertThat(row.verified).isEqualTo(1);
        assertThat(row.epochDay).isEqualTo((int) LocalDate.of(2020, 2, 29).toEpochDay());
    }

    @Test
    void starsWrittenAsDecimalsWithZeroFractionAreAccepted() {
        assertThat(parse(tsv(), SampleDump.rowWith(4, "3.0")).isNone()).isTrue();
        assertThat(row.stars).isEqualTo(3);
        assertThat(parse(tsv(), SampleDump.rowWith(4, "1.00")).isNone()).isTrue();
        assertThat(row.stars).isEqualTo(1);
    }

    @Test
    void flagsAcceptEverySpellingInAnyCase() {
        String[] yes = {"Y", "y", "yes", "YES", "Yes", "true", "TRUE", "True", "1"};
        String[] no = {"N", "n", "no", "NO", "No", "false", "FALSE", "False", "0"};
        for (String s : yes) {
            assertThat(parse(tsv(), SampleDump.rowWith(7, s)).isNone()).as(s).isTrue();
            assertThat(row.verified).as(s).isEqualTo(1);
        }
        for (String s : no) {
            assertThat(parse(tsv(), SampleDump.rowWith(8, s)).isNone()).as(s).isTrue();
            assertThat(row.incentivised).as(s).isEqualTo(0);
        }
        for (String s : new String[] {"ye", "t", "f", "nope", "yes!", "11", "0 0", "\u00dd"}) {
            assertThat(parse(tsv(), SampleDump.rowWith(7, s)).reason()).as(s).isEqualTo(Reject.BAD_FLAG);
        }
    }

    @Test
    void aTimeAfterTheDateIsIgnored() {
        int day = (int) LocalDate.of(2021, 3, 14).toEpochDay();
        for (String s : new String[] {"2021-03-14T10:00:00", "2021-03-14 10:00", "2021-03-14T23:59:59.999Z"}) {
            assertThat(parse(tsv(), SampleDump.rowWith(9, s)).isNone()).as(s).isTrue();
            assertThat(row.epochDay).isEqualTo(day);
        }
    }

    @Test
    void crlfLineEndsAreStripped() {
        RowParser p = new RowParser(ColumnMapping.of(4, Map.of(Field.REVIEWER, 0, Field.HELPFUL, 1, Field.TOTAL, 2,
                Field.DATE, 3)), Format.TSV);
        assertThat(parse(p, "R1\t1\t2\t2021-01-01\r").isNone()).isTrue();
        assertThat(row.epochDay).isEqualTo((int) LocalDate.of(2021, 1, 1).toEpochDay());
        RowParser q = new RowParser(ColumnMapping.of(3, Map.of(Field.REVIEWER, 2, Field.HELPFUL, 0, Field.TOTAL, 1)), Format.TSV);
        assertThat(parse(q, "1\t2\tR7\r").isNone()).isTrue();
        assertThat(row.reviewer()).isEqualTo("R7");
    }

    @Test
    void categoryColumnWinsWhenNotEmptyElseTheFilesCategory() {
        RowParser p = tsv();
        assertThat(parse(p, SampleDump.rowWith(3, "kitchen")).isNone()).isTrue();
        assertThat(row.category()).isEqualTo("kitchen");
        assertThat(parse(p, SampleDump.rowWith(3, "")).isNone()).isTrue();
        assertThat(row.category()).isEqualTo("garden");
        // The fallback follows the row's file.
        byte[] line = SampleDump.rowWith(3, "").getBytes(StandardCharsets.UTF_8);
        row.file = TOYS;
        assertThat(p.parse(line, 0, line.length, row).isNone()).isTrue();
        assertThat(row.category()).isEqualTo("toys");
        row.file = null;
        assertThat(p.parse(line, 0, line.length, row).isNone()).isTrue();
        assertThat(row.category()).isEmpty();
    }

    // ---- CSV (RFC 4180, https://www.rfc-editor.org/rfc/rfc4180, section 2) ----

    private static RowParser csv() {
        return new RowParser(SampleDump.mapping(), Format.CSV);
    }

    private static String csvRow(String... fields) {
        return String.join(",", fields);
    }

    @Test
    void csvQuotedFieldsMayHoldCommasAndDoubledQuotes() {
        String line = csvRow("\"R,1\"", "V1", "\"IT\"\"EM\"", "\"\"", "\"5\"", "2", "3", "Y", "N", "2021-03-14",
                "\"Good, \"\"really\"\" good\"", "plain text");
        Reject r = parse(csv(), line);
        assertThat(r.isNone()).isTrue();
        assertThat(row.reviewer()).isEqualTo("R,1");
        assertThat(row.item()).isEqualTo("IT\"EM");
        assertThat(row.category()).isEqualTo("garden");
        assertThat(row.stars).isEqualTo(5);
        assertThat(row.helpful).isEqualTo(2);
        assertThat(row.total).isEqualTo(3);
    }

    @Test
    void csvUnescapingLeavesTheCallersBufferAlone() {
        byte[] line = csvRow("\"A\"\"B\"", "V1", "I", "c", "4", "1", "1", "Y", "N", "2021-03-14", "h", "b")
                .getBytes(StandardCharsets.UTF_8);
        byte[] copy = line.clone();
        row.file = GARDEN;
        assertThat(csv().parse(line, 0, line.length, row).isNone()).isTrue();
        assertThat(row.reviewer()).isEqualTo("A\"B");
        assertThat(row.category()).isEqualTo("c");
        assertThat(line).isEqualTo(copy);
    }

    @Test
    void csvQuoteInsideAnUnquotedFieldIsData() {
        assertThat(parse(csv(), csvRow("R\"1", "V", "I", "c", "4", "1", "1", "Y", "N", "", "5\" pot", "b")).isNone()).isTrue();
        assertThat(row.reviewer()).isEqualTo("R\"1");
    }

    @Test
    void csvQuotedLineBreaksAreRejectedCleanly() {
        // The scanner splits at LF, so a quoted field with a line break arrives cut in two.
        Reject first = parse(csv(), csvRow("R1", "V", "I", "c", "4", "1", "1", "Y", "N", "2021-03-14", "h", "\"line one"));
        assertThat(first.reason()).isEqualTo(Reject.BAD_QUOTE);
        assertThat(first.field()).isEqualTo(Reject.ROW);
        assertThat(first.value()).isEqualTo("\"line one");
        assertThat(first.message()).contains("column 12").contains("line break inside quotes is not supported");
        Reject second = parse(csv(), "line two\"");
        assertThat(second.reason()).isEqualTo(Reject.FIELD_COUNT);
        Reject after = parse(csv(), csvRow("\"R1\"x", "V", "I", "c", "4", "1", "1", "Y", "N", "", "h", "b"));
        assertThat(after.reason()).isEqualTo(Reject.BAD_QUOTE);
        assertThat(after.field()).isEqualTo("reviewer");
    }

    @Test
    void csvFieldCountRespectsQuotedCommas() {
        assertThat(parse(csv(), csvRow("R1", "V", "I", "c", "4", "1", "1", "Y", "N", "", "h", "\"a,b,c\"")).isNone()).isTrue();
        assertThat(parse(csv(), csvRow("R1", "V", "I", "c", "4", "1", "1", "Y", "N", "", "h", "a,b")).message())
                .isEqualTo("expected 12 fields, found 13");
    }

    @Test
    void csvHeaderIsUnquoted() {
        byte[] h = "\uFEFF\"reviewer id\",\"helpful \"\"up\"\" votes\",total,\"a,b\"\r".getBytes(StandardCharsets.UTF_8);
        assertThat(RowParser.splitHeader(h, 0, h.length, Format.CSV))
                .containsExactly("reviewer id", "helpful \"up\" votes", "total", "a,b");
        byte[] t = "\uFEFFreviewer\t\"helpful\"\ttotal".getBytes(StandardCharsets.UTF_8);
        assertThat(RowParser.splitHeader(t, 0, t.length, Format.TSV)).containsExactly("reviewer", "\"helpful\"", "total");
    }

    // ---- numbers and dates against the JDK ----

    /**
     * The JDK is the reference: {@code Long.parseLong} for the value and the overflow boundary.
     * We accept plain ASCII digits only, so strings with a sign or other digits must be rejected
     * even where {@code Long.parseLong} takes them.
     */
    @Test
    void wholeNumbersAgreeWithLongParseLong() {
        Random rnd = new Random(20240501L);
        List<String> cases = new java.util.ArrayList<>(List.of("0", "00", "007", "9", "10",
                Long.toString(Long.MAX_VALUE), "9223372036854775806", "9223372036854775808", "9223372036854775809",
                "18446744073709551616", "00000000000000000000009223372036854775807", "-0", "-1", "+1", "1_000",
                "1e3", "0x1F", " 1", "1 ", "", "\u0661\u0662", "\uff11", "12a", "--1"));
        for (int i = 0; i < 20000; i++) {
            int kind = rnd.nextInt(4);
            cases.add(switch (kind) {
                case 0 -> Long.toString(rnd.nextLong() & Long.MAX_VALUE);
                case 1 -> Long.toString(rnd.nextInt(1000));
                case 2 -> digits(rnd, 1 + rnd.nextInt(25));
                default -> randomAscii(rnd, 1 + rnd.nextInt(6));
            });
        }
        for (String s : cases) {
            byte[] b = s.getBytes(StandardCharsets.UTF_8);
            long got = RowParser.wholeNumber(b, 0, b.length);
            long expected;
            if (!s.matches("[0-9]+")) {
                expected = -1;
            } else {
                try {
                    expected = Long.parseLong(s);
                } catch (NumberFormatException e) {
                    expected = -2;
                }
            }
            assertThat(got).as("'%s'", s).isEqualTo(expected);
        }
    }

    /**
     * The JDK is the reference: {@code LocalDate.parse} (ISO_LOCAL_DATE, strict resolution, so
     * 2021-02-30 fails) and {@code toEpochDay}, on every day of 1600-2400 and on random
     * year-month-day triples including impossible months and days.
     */
    @Test
    void datesAgreeWithLocalDate() {
        for (LocalDate d = LocalDate.of(1600, 1, 1); d.isBefore(LocalDate.of(2400, 1, 1)); d = d.plusDays(1)) {
            byte[] b = d.toString().getBytes(StandardCharsets.US_ASCII);
            assertThat(RowParser.epochDay(b, 0, b.length)).as(d.toString()).isEqualTo((int) d.toEpochDay());
        }
        Random rnd = new Random(7L);
        for (int i = 0; i < 50000; i++) {
            String s = String.format("%04d-%02d-%02d", rnd.nextInt(10000), rnd.nextInt(14), rnd.nextInt(33));
            byte[] b = s.getBytes(StandardCharsets.US_ASCII);
            int got = RowParser.epochDay(b, 0, b.length);
            Integer expected;
            try {
                expected = (int) LocalDate.parse(s).toEpochDay();
            } catch (DateTimeParseException e) {
                expected = null;
            }
            if (expected == null) {
                assertThat(got).as(s).isEqualTo(Integer.MIN_VALUE + 1);
            } else {
                assertThat(got).as(s).isEqualTo(expected);
            }
        }
        for (String s : new String[] {"0000-01-01", "0000-02-29", "9999-12-31", "2000-02-29", "2100-02-28", "1970-01-01"}) {
            byte[] b = s.getBytes(StandardCharsets.US_ASCII);
            assertThat(RowParser.epochDay(b, 0, b.length)).as(s).isEqualTo((int) LocalDate.parse(s).toEpochDay());
        }
        for (String s : new String[] {"2100-02-29", "1900-02-29", "2021-04-31", "2021-06-31", "2021-09-31", "2021-11-31",
            "202a-01-01", "2021-01-0x", "2021/01/01", "2021-01-1", "-001-01-01"}) {
            byte[] b = s.getBytes(StandardCharsets.US_ASCII);
            assertThat(RowParser.epochDay(b, 0, b.length)).as(s).isEqualTo(Integer.MIN_VALUE + 1);
            assertThatThrownBy(() -> LocalDate.parse(s)).as(s).isInstanceOf(DateTimeParseException.class);
        }
    }

    private static String digits(Random rnd, int n) {
        StringBuilder b = new StringBuilder();
        for (int i = 0; i < n; i++) {
            b.append((char) ('0' + rnd.nextInt(10)));
        }
        return b.toString();
    }

    private static String randomAscii(Random rnd, int n) {
        String alphabet = "0123456789+-. eE_x";
        StringBuilder b = new StringBuilder();
        for (int i = 0; i < n; i++) {
            b.append(alphabet.charAt(rnd.nextInt(alphabet.length())));
        }
        return b.toString();
    }

    private static String[] replace(String[] f, Map<Integer, String> with) {
        with.forEach((i, v) -> f[i] = v);
        return f;
    }

    /**
     * Finding a TSV line's end and fields in one pass must give what finding the end first and
     * then parsing the line gives: same reject reason, field and value, same row, for lines with
     * stray tabs and control bytes, CR endings, blanks, missing and extra fields and bad values.
     */
    @Test
    void oneTsvPassParsesLikeLineEndThenFields() {
        Random rnd = new Random(23);
        RowParser oneByOne = tsv();
        RowParser onePass = tsv();
        String[] junk = {"\t", "\r", "\u0001", "\u0008", " ", "", "x", "é", "-1", "9999999999999999999", "2021-02-30", "4.0"};
        ReviewRow expected = new ReviewRow();
        for (int round = 0; round < 20_000; round++) {
            StringBuilder line = new StringBuilder(SampleDump.row("R" + rnd.nextInt(100), rnd.nextInt(3), 2 + rnd.nextInt(3)));
            for (int k = rnd.nextInt(4); k > 0; k--) {
                int at = rnd.nextInt(line.length() + 1);
                line.insert(at, junk[rnd.nextInt(junk.length)]);
            }
            if (rnd.nextInt(5) == 0) {
                line.setLength(rnd.nextInt(line.length() + 1));
            }
            if (rnd.nextInt(4) == 0) {
                line.append('\r');
            }
            if (rnd.nextInt(50) == 0) {
                line.setLength(0);
                line.append(rnd.nextBoolean() ? " \t " : "\r");
            }
            byte[] text = line.toString().getBytes(StandardCharsets.UTF_8);
            // The line with its LF, then the start of another line, at an offset in a larger buffer.
            int off = rnd.nextInt(9);
            byte[] b = new byte[off + text.length + 6];
            System.arraycopy(text, 0, b, off, text.length);
            b[off + text.length] = '\n';
            System.arraycopy("R2\t1\t".getBytes(StandardCharsets.US_ASCII), 0, b, off + text.length + 1, 5);
            expected.file = GARDEN;
            Reject want = oneByOne.parse(b, off, off + text.length, expected);
            row.file = GARDEN;
            int lf = onePass.scanTsv(b, off, b.length);
            assertThat(lf).isEqualTo(off + text.length);
            Reject got = onePass.parseScanned(b, off, lf, row);
            String what = line.toString().replace("\t", "<TAB>").replace("\r", "<CR>");
            assertThat(got).as(what).isEqualTo(want);
            if (want.isNone()) {
                assertThat(row.reviewer()).as(what).isEqualTo(expected.reviewer());
                assertThat(row.review()).as(what).isEqualTo(expected.review());
                assertThat(row.item()).as(what).isEqualTo(expected.item());
                assertThat(row.category()).as(what).isEqualTo(expected.category());
                assertThat(new long[] {row.helpful, row.total, row.stars, row.verified, row.incentivised, row.epochDay}).as(what)
                        .containsExactly(expected.helpful, expected.total, expected.stars, expected.verified,
                                expected.incentivised, expected.epochDay);
            }
            // Cut before the LF, the line is not complete.
            assertThat(onePass.scanTsv(b, off, off + text.length)).isEqualTo(-1);
        }
    }
}
