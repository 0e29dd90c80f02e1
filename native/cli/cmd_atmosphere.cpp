// `firn pressure` and `firn altitude`: barometric pressure ↔ altitude, both models side by side.
#include <memory>

#include "cli/cli.hpp"
#include "model/atmosphere.hpp"
#include "model/cautions.hpp"
#include "model/latitude_month.hpp"

namespace firn::cli {
namespace {

using namespace units;
namespace atm = firn::atmosphere;

struct PressureOptions {
  std::optional<std::string> altitude, model, qnh, temperature, temperature_at, station;
  LatitudeMonthOptions where;
};

struct AltitudeOptions {
  std::optional<std::string> pressure, model;
  LatitudeMonthOptions where;
};

void add_caution(Report& report) {
  report.json["caution"] = std::string(cautions::short_line);
  report.notes.emplace_back(cautions::short_line);
}

void add_pressure_rows(Report& report, const std::string& prefix, const std::string& label,
                       Pressure p) {
  report.add(prefix + "pressure_hpa", p.in(hectopascals), 2, label, "hPa");
  report.add(prefix + "pressure_mmhg", p.in(mmhg), 1, label, "mmHg");
  report.add(prefix + "pressure_kpa", p.in(kilopascals), 3, label, "kPa");
  report.add(prefix + "pressure_inhg", p.in(inhg), 2, label, "inHg");
}

std::string_view check_key(atm::ReadingCheck verdict) {
  switch (verdict) {
    case atm::ReadingCheck::LooksLikeSeaLevel: return "sea_level_figure";
    case atm::ReadingCheck::Mismatch: return "mismatch";
    case atm::ReadingCheck::Consistent: break;
  }
  return "consistent";
}

// `pressure --station P [--altitude A]`: the reading is PB; with an altitude, the two are
// cross-checked (atm::check_station_reading decides).
Result<Report> run_station(const PressureOptions& o, atm::Model model) {
  if (o.qnh || o.temperature) return Error{"give --station or --qnh, not both"};
  Result<Pressure> reading = required_pressure(o.station, "--station", "station barometer reading",
                                               atm::kStationReadingRange);
  if (!reading) return reading.error();
  Result<Pressure> checked = atm::pressure_from_station_reading(reading.value());
  if (!checked) return Error{"--station: " + checked.error().message};
  Report report;
  report.add_text("method", "station", "Method");
  report.add_text("model", std::string(atm::model_key(model)), "Model");
  add_pressure_rows(report, "", "Barometric pressure", reading.value());
  if (Result<Length> a = atm::altitude_at(reading.value(), model)) {
    report.add("pressure_altitude_m", a->in(metres), 1,
               "Pressure altitude (" + std::string(atm::model_name(model)) + ")", "m");
  } else {
    report.json["pressure_altitude_m"] = nullptr;
    report.rows.emplace_back("Pressure altitude", "outside model range");
  }
  if (o.altitude) {
    Result<Length> altitude = required_length(o.altitude, "--altitude", "altitude",
                                              atm::latitude_month_altitude_range());
    if (!altitude) return altitude.error();
    Result<atm::StationCheck> check = atm::check_station_reading(reading.value(), altitude.value(), model);
    if (!check) return Error{"--altitude: " + check.error().message};
    report.add("altitude_m", altitude->in(metres), 1, "Altitude (entered)", "m");
    report.add("expected_low_hpa", check->expected_low.in(hectopascals), 1, "Usual here, lowest", "hPa");
    report.add("expected_high_hpa", check->expected_high.in(hectopascals), 1, "Usual here, highest", "hPa");
    report.add_text("station_check", std::string(check_key(check->verdict)), "Reading vs altitude");
    report.json["station_check_message"] = check->message;
    if (check->verdict != atm::ReadingCheck::Consistent) report.notes.push_back("CHECK: " + check->message);
  }
  add_caution(report);
  return report;
}

Result<Report> run_pressure(const PressureOptions& o) {
  Result<atm::Model> model = model_option(o.model);
  if (!model) return model.error();
  bool latitude_given = o.where.latitude || o.where.month;
  if (latitude_given && (o.qnh || o.station)) {
    return Error{"--latitude/--month give the pressure from the altitude: not with --qnh or --station"};
  }
  if (o.station) return run_station(o, model.value());
  Result<Length> altitude =
      required_length(o.altitude, "--altitude", "altitude",
                      o.qnh ? atm::kSiteAltitudeRange : atm::altitude_range(model.value()));
  if (!altitude) return altitude.error();

  Report report;
  report.add("altitude_m", altitude->in(metres), 1, "Altitude", "m");
  Result<Pressure> pressure = Error{""};
  std::string method;
  if (o.qnh) {
    Result<Pressure> qnh = required_pressure(o.qnh, "--qnh", "QNH", atm::kQnhRange);
    if (!qnh) return qnh.error();
    if (o.temperature) {
      Result<Temperature> t = required_temperature(o.temperature, "--temperature", "air temperature",
                                                   atm::kAirTemperatureRange);
      if (!t) return t.error();
      atm::TemperatureAt where = atm::TemperatureAt::SeaLevel;
      if (o.temperature_at && *o.temperature_at == "station") {
        where = atm::TemperatureAt::Station;
      } else if (o.temperature_at && *o.temperature_at != "sea-level") {
        return Error{"--temperature-at must be sea-level or station"};
      }
      Result<atm::QnhWithTemperature> q = atm::qnh_with_temperature(altitude.value(), qnh.value(), t.value(), where);
      if (!q) return q.error();
      pressure = q->with_temperature;
      report.add("standard_lapse_pressure_hpa", q->standard_lapse.in(hectopascals), 2,
                 "QNH by standard lapse", "hPa");
      report.json["qnh_note"] = q->note;
      report.notes.push_back(q->note);
      method = where == atm::TemperatureAt::Station ? "qnh+station-temperature (hypsometric)"
                                                    : "qnh+sea-level-temperature (hypsometric)";
    } else {
      pressure = atm::pressure_from_qnh(altitude.value(), qnh.value());
      method = "qnh (standard lapse)";
    }
  } else {
    if (o.temperature) return Error{"--temperature needs --qnh (the day's sea-level pressure)"};
    pressure = ambient_pressure(altitude.value(), model.value(), o.where, report);
    method = latitude_given ? "latitude-month (" + std::string(atm::latitude_month_model_name()) + ")"
                            : std::string(atm::model_key(model.value()));
  }
  if (!pressure) return pressure.error();

  report.add_text("method", method, "Method");
  report.add_text("model", std::string(atm::model_key(model.value())), "Model");
  add_pressure_rows(report, "", "Barometric pressure", pressure.value());
  // Both models side by side, whenever they are valid at this altitude.
  for (atm::Model each : {atm::Model::West1996, atm::Model::Isa}) {
    Result<Pressure> p = atm::pressure_at(altitude.value(), each);
    std::string key = std::string(atm::model_key(each)) + "_pressure_hpa";
    if (p) {
      report.add(key, p->in(hectopascals), 2, std::string(atm::model_name(each)), "hPa");
    } else {
      report.json[key] = nullptr;
      report.rows.emplace_back(std::string(atm::model_name(each)), "outside model range");
    }
  }
  add_caution(report);
  return report;
}

Result<Report> run_altitude(const AltitudeOptions& o) {
  Result<atm::Model> model = model_option(o.model);
  if (!model) return model.error();
  Result<std::optional<atm::LatitudeMonth>> where = latitude_month_option(o.where);
  if (!where) return where.error();
  auto altitude_for = [&](Pressure p) {
    return where.value() ? atm::altitude_at(p, *where.value()) : atm::altitude_at(p, model.value());
  };
  Result<Pressure> pressure = required_pressure(
      o.pressure, "--pressure", "barometric pressure",
      where.value() ? atm::pressure_range(*where.value()) : atm::pressure_range(model.value()));
  if (!pressure) return pressure.error();
  Result<Length> altitude = altitude_for(pressure.value());
  if (!altitude) return altitude.error();
  Report report;
  report.add("pressure_hpa", pressure->in(hectopascals), 2, "Barometric pressure", "hPa");
  report.add_text("model", std::string(atm::model_key(model.value())), "Model");
  if (where.value()) {
    report.add("latitude_deg", where.value()->latitude_deg, 2, "Latitude", "deg");
    report.add("month", where.value()->month, 0, "Month", "");
    report.add_text("pressure_source",
                    "latitude-month (" + std::string(atm::latitude_month_model_name()) + ")",
                    "Altitude from");
  }
  report.add("altitude_m", altitude->in(metres), 1, "Altitude", "m");
  report.add("altitude_ft", altitude->in(feet), 0, "Altitude", "ft");
  for (atm::Model each : {atm::Model::West1996, atm::Model::Isa}) {
    Result<Length> a = atm::altitude_at(pressure.value(), each);
    std::string key = std::string(atm::model_key(each)) + "_altitude_m";
    if (a) {
      report.add(key, a->in(metres), 1, std::string(atm::model_name(each)), "m");
    } else {
      report.json[key] = nullptr;
      report.rows.emplace_back(std::string(atm::model_name(each)), "outside model range");
    }
  }
  add_caution(report);
  return report;
}

}  // namespace

void register_atmosphere_commands(CommandTable& table) {
  auto p = std::make_shared<PressureOptions>();
  CLI::App* pressure = table.add("pressure", "Barometric pressure at an altitude",
                                 [p] { return run_pressure(*p); });
  pressure->add_option("--altitude", p->altitude, "Altitude, e.g. 4000m or 13120ft");
  pressure->add_option("--model", p->model, "Atmosphere model: west (default) or isa");
  pressure->add_option("--qnh", p->qnh, "The day's sea-level pressure (QNH), e.g. 1013hPa");
  pressure->add_option("--temperature", p->temperature, "Air temperature with --qnh, e.g. -5C");
  pressure->add_option("--temperature-at", p->temperature_at,
                       "Where --temperature was taken: sea-level (default) or station");
  pressure->add_option("--station", p->station,
                       "A station barometer reading (not QNH); with --altitude, cross-checked");
  add_latitude_month_options(pressure, p->where);

  auto a = std::make_shared<AltitudeOptions>();
  CLI::App* altitude = table.add("altitude", "Altitude from a barometric pressure",
                                 [a] { return run_altitude(*a); });
  altitude->add_option("--pressure", a->pressure, "Barometric pressure, e.g. 616hPa or 462mmHg");
  altitude->add_option("--model", a->model, "Atmosphere model: west (default) or isa");
  add_latitude_month_options(altitude, a->where);
}

}  // namespace firn::cli
