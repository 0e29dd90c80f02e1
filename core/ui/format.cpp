#include "ui/format.hpp"

#include <algorithm>
#include <cmath>

#include "model/result.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

using namespace units;

std::string_view altitude_unit_symbol(const UnitChoice& u) {
  return u.altitude == UnitChoice::Altitude::Feet ? feet.symbol : metres.symbol;
}

std::string_view pressure_unit_symbol(const UnitChoice& u) {
  switch (u.pressure) {
    case UnitChoice::Pressure::Millimetres: return mmhg.symbol;
    case UnitChoice::Pressure::Kilopascals: return kilopascals.symbol;
    case UnitChoice::Pressure::InchesHg: return inhg.symbol;
    case UnitChoice::Pressure::Hectopascals: break;
  }
  return hectopascals.symbol;
}

std::string altitude_text(Length altitude, const UnitChoice& u) {
  double value = u.altitude == UnitChoice::Altitude::Feet ? altitude.in(feet) : altitude.in(metres);
  // Up to 2 decimals so a value typed in the other unit survives the round trip on screen.
  return format_number(value, 2);
}

std::string altitude_with_unit(Length altitude, const UnitChoice& u) {
  double value = u.altitude == UnitChoice::Altitude::Feet ? altitude.in(feet) : altitude.in(metres);
  return shown_number(value, 0) + " " + std::string(altitude_unit_symbol(u));
}

std::string pressure_text(Pressure pressure, const UnitChoice& u) {
  switch (u.pressure) {
    case UnitChoice::Pressure::Millimetres:
      return shown_number(pressure.in(mmhg), 1) + " mmHg";
    case UnitChoice::Pressure::Kilopascals:
      return shown_number(pressure.in(kilopascals), 2) + " kPa";
    case UnitChoice::Pressure::InchesHg:
      return shown_number(pressure.in(inhg), 2) + " inHg";
    case UnitChoice::Pressure::Hectopascals: break;
  }
  return shown_number(pressure.in(hectopascals), 1) + " hPa";
}

std::string grouped_number(double value, int decimals) {
  std::string plain = shown_number(value, decimals);
  if (!std::isfinite(value)) return plain;
  bool negative = !plain.empty() && plain[0] == '-';
  if (negative) plain.erase(0, 1);
  size_t integer_end = plain.find('.');
  if (integer_end == std::string::npos) integer_end = plain.size();
  // Groups of three split by a no-break space (SI Brochure, 9th ed. 2019, 5.4.4: a space, never
  // a dot or comma): reads the same in decimal-comma and decimal-point countries, never wraps.
  for (size_t i = integer_end; i > 3; i -= 3) plain.insert(i - 3, "\xC2\xA0");
  return negative ? "\xE2\x88\x92" + plain : plain;
}

namespace {
// Rounds toward the inside of the range (up for a low bound, down for a high one).
double round_inward(double value, bool up, int decimals) {
  if (value == 0.0 || !std::isfinite(value)) return value;
  double magnitude = std::floor(std::log10(std::fabs(value)));
  double step = std::max(std::pow(10.0, magnitude - 2.0), std::pow(10.0, -decimals));
  double scaled = value / step;
  return (up ? std::ceil(scaled - 1e-9) : std::floor(scaled + 1e-9)) * step;
}
int decimals_for(double value, int decimals) {
  for (int d = 0; d < decimals; ++d) {
    double scaled = value * std::pow(10.0, d);
    if (std::fabs(scaled - std::round(scaled)) < 1e-6) return d;
  }
  return decimals;
}
}  // namespace

std::string range_text(double low, double high, std::string_view symbol, int decimals) {
  double shown_low = round_inward(low, true, decimals);
  double shown_high = round_inward(high, false, decimals);
  std::string text = grouped_number(shown_low, decimals_for(shown_low, decimals)) + " to " +
                     grouped_number(shown_high, decimals_for(shown_high, decimals));
  if (!symbol.empty()) text += " " + std::string(symbol);
  return text;
}

}  // namespace firn::ui

namespace firn::ui {

using namespace units;

std::string cylinder_pressure_text(Pressure gauge, const UnitChoice& u) {
  if (u.cylinder == UnitChoice::CylinderPressure::Psi) return shown_number(gauge.in(psi), 0) + " psi";
  return shown_number(gauge.in(bar), 0) + " bar";
}

std::string temperature_text(Temperature t, const UnitChoice& u) {
  if (u.temperature == UnitChoice::Temperature::Fahrenheit) return shown_number(t.in(fahrenheit), 0) + " \xC2\xB0" "F";
  return shown_number(t.in(celsius), 0) + " \xC2\xB0" "C";
}

std::string percent_text(Fraction f, int decimals) { return shown_number(f.in(percent), decimals) + " %"; }

std::string flow_text(VolumeFlow flow) { return shown_number(flow.in(litres_per_minute), 1) + " L/min"; }

std::string volume_text(Volume v) { return shown_number(v.in(litres), 0) + " L"; }

std::string duration_text(Duration d) {
  double total = d.in(minutes);
  if (!std::isfinite(total)) return "\xE2\x80\x94";
  long rounded = std::lround(total);
  if (rounded < 60) return std::to_string(rounded) + " min";
  return std::to_string(rounded / 60) + " h " + std::to_string(rounded % 60) + " min";
}

std::string gas_pressure_range_text(Pressure low, Pressure high, const UnitChoice& u) {
  if (u.pressure == UnitChoice::Pressure::Kilopascals) {
    return shown_number(low.in(kilopascals), 1) + "\xE2\x80\x93" + shown_number(high.in(kilopascals), 1) + " kPa";
  }
  return shown_number(low.in(mmhg), 0) + "\xE2\x80\x93" + shown_number(high.in(mmhg), 0) + " mmHg";
}

std::string gas_pressure_text(Pressure p, const UnitChoice& u) {
  if (u.pressure == UnitChoice::Pressure::Kilopascals) return shown_number(p.in(kilopascals), 1) + " kPa";
  return shown_number(p.in(mmhg), 0) + " mmHg";
}

}  // namespace firn::ui
