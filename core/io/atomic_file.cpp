#include "io/atomic_file.h"

#include <cerrno>
#include <cstdio>
#include <cstring>
#include <fstream>
#include <sstream>
#include <vector>

#include <fcntl.h>
#include <sys/stat.h>
#include <unistd.h>

namespace abut {

namespace {

std::string folderOf(const std::string& path) {
    const auto slash = path.find_last_of('/');
    if (slash == std::string::npos) return ".";
    return slash == 0 ? "/" : path.substr(0, slash);
}

} // namespace

WriteResult writeFileAtomically(const std::string& path, const std::string& data,
                                std::optional<WriteFault> fault) {
    std::string tmpl = folderOf(path) + "/.abut-save-XXXXXX";
    std::vector<char> name(tmpl.begin(), tmpl.end());
    name.push_back('\0');
    const int fd = ::mkstemp(name.data());
    if (fd < 0)
        return {false, path + ": cannot create a temporary file beside it: " + std::strerror(errno)};
    const std::string tmpPath(name.data());

    auto fail = [&](const std::string& why) {
        ::close(fd);
        ::unlink(tmpPath.c_str());
        return WriteResult{false, path + ": " + why + "; the previous file is unchanged"};
    };

    // Keep the permissions of the file being replaced, or the usual 0644.
    struct stat st {};
    const mode_t mode = (::stat(path.c_str(), &st) == 0) ? (st.st_mode & 07777) : 0644;
    ::fchmod(fd, mode);

    std::size_t written = 0;
    while (written < data.size()) {
        std::size_t chunk = data.size() - written;
        if (fault && written + chunk > fault->failAfterBytes) {
            chunk = fault->failAfterBytes > written ? fault->failAfterBytes - written : 0;
            if (chunk == 0) return fail("write failed: no space left on device (simulated)");
        }
        const ssize_t n = ::write(fd, data.data() + written, chunk);
        if (n < 0) {
            if (errno == EINTR) continue;
            return fail(std::string("write failed: ") + std::strerror(errno));
        }
        written += static_cast<std::size_t>(n);
    }
    if (::fsync(fd) != 0) return fail(std::string("flush failed: ") + std::strerror(errno));
    if (::close(fd) != 0) {
        ::unlink(tmpPath.c_str());
        return {false, path + ": close failed: " + std::strerror(errno)};
    }
    if (::rename(tmpPath.c_str(), path.c_str()) != 0) {
        const std::string why = std::strerror(errno);
        ::unlink(tmpPath.c_str());
        return {false, path + ": cannot replace the file: " + why + "; the previous file is unchanged"};
    }
    return {};
}

std::optional<std::string> readFile(const std::string& path, std::string* message) {
    std::ifstream in(path, std::ios::binary);
    if (!in) {
        if (message) *message = path + ": cannot open: " + std::strerror(errno);
        return std::nullopt;
    }
    std::ostringstream ss;
    ss << in.rdbuf();
    if (in.bad()) {
        if (message) *message = path + ": read failed";
        return std::nullopt;
    }
    return ss.str();
}

} // namespace abut
