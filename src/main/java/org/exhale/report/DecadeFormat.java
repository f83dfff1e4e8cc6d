package org.exhale.report;

import java.math.BigDecimal;
import java.text.FieldPosition;
import java.text.NumberFormat;
import java.text.ParsePosition;

/** Log-axis tick labels: plain numbers from 0.001 to 1000, powers of ten (10⁻⁶) beyond. */
final class DecadeFormat extends NumberFormat {
    private static final long serialVersionUID = 1L;
    private static final char[] SUPER = {'⁰', '¹', '²', '³', '⁴', '⁵', '⁶', '⁷', '⁸', '⁹'};

    @Override
    public StringBuffer format(double v, StringBuffer to, FieldPosition pos) {
        if (!(v > 0) || !Double.isFinite(v)) {
            return to.append(ReportText.sig(v, 3));
        }
        double e = Math.log10(v);
        long n = Math.round(e);
        if (Math.abs(e - n) > 1e-6) {
            return to.append(ReportText.sig(v, 3));
        }
        if (n >= -3 && n <= 3) {
            return to.append(BigDecimal.valueOf(1, (int) -n).stripTrailingZeros().toPlainString());
        }
        to.append("10");
        String digits = Long.toString(Math.abs(n));
        if (n < 0) {
            to.append('⁻');
        }
        for (char c : digits.toCharArray()) {
            to.append(SUPER[c - '0']);
        }
        return to;
    }

    @Override
    public StringBuffer format(long v, StringBuffer to, FieldPosition pos) {
        return format((double) v, to, pos);
    }

    @Override
    public Number parse(String source, ParsePosition pos) {
        throw new UnsupportedOperationException("tick labels are only written");
    }
}
